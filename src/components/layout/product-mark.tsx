/**
 * The Fluxwright mark: nested shield layers (two rounded squares around a quiet core) with the
 * outside field lines bowing around them instead of passing through.
 */
export function ProductMark({ className = "size-9" }: { className?: string }) {
  return (
    <svg className={className} viewBox="0 0 40 40" aria-hidden="true" focusable="false">
      <g fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" opacity="0.7">
        <path d="M3 16c5 0 5-10 17-10s12 10 17 10" />
        <path d="M3 24c5 0 5 10 17 10s12-10 17-10" />
      </g>
      <rect x="11" y="11" width="18" height="18" rx="5" fill="none" stroke="currentColor" strokeWidth="2.2" />
      <rect x="15" y="15" width="10" height="10" rx="2.5" fill="none" stroke="currentColor" strokeWidth="2" opacity="0.75" />
      <rect x="18.25" y="18.25" width="3.5" height="3.5" rx="1" className="fill-anneal-400" />
    </svg>
  );
}
