import type { ReactNode } from "react";

/**
 * A wide table that scrolls sideways on a narrow screen. The region takes keyboard focus, so the
 * arrow keys scroll it for someone who does not use a pointer, and is named for screen readers.
 */
export function ScrollX({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={label}>
      {children}
    </div>
  );
}
