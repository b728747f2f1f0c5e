import { useCallback, useLayoutEffect, useRef, useState } from "react";

/**
 * The rendered width of an element in CSS pixels, kept up to date as it resizes (0 before the
 * first measurement). Tables and drawings use it to fit their place, not the window's.
 */
export function useElementWidth<E extends HTMLElement>(): [(node: E | null) => void, number] {
  const [node, setNode] = useState<E | null>(null);
  const [width, setWidth] = useState(0);
  const observer = useRef<ResizeObserver | null>(null);
  const ref = useCallback((el: E | null) => setNode(el), []);
  useLayoutEffect(() => {
    if (!node) return;
    setWidth(node.getBoundingClientRect().width);
    if (typeof ResizeObserver === "undefined") return;
    observer.current = new ResizeObserver((entries) => {
      const w = entries[0]?.contentRect.width;
      if (w !== undefined) setWidth((old) => (Math.abs(old - w) >= 1 ? w : old));
    });
    observer.current.observe(node);
    return () => observer.current?.disconnect();
  }, [node]);
  return [ref, width];
}
