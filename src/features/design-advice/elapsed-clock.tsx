import { useEffect, useState } from "react";

/**
 * Seconds since it appeared, ticking: an honest clock for a search that reports no progress of
 * its own. Its own component, so the tick re-renders only this text, not the answer beside it.
 */
export function ElapsedClock({ className = "" }: { className?: string }) {
  const [start] = useState(() => performance.now());
  const [now, setNow] = useState(start);
  useEffect(() => {
    const timer = window.setInterval(() => setNow(performance.now()), 100);
    return () => window.clearInterval(timer);
  }, []);
  return (
    <span className={className} aria-hidden="true" data-testid="search-elapsed">
      {((now - start) / 1000).toFixed(1)} s
    </span>
  );
}
