import { useId, useState, type ReactNode } from "react";

/**
 * A group that opens and closes under its heading, with a one-line digest of what is inside while
 * closed, so a long settings page reads as a list of its parts. The content stays mounted when
 * closed (a half-edited form keeps what was typed).
 */
export function Disclosure({ title, digest, children, defaultOpen = false, testId }: { title: string; digest?: ReactNode; children: ReactNode; defaultOpen?: boolean; testId?: string }) {
  const [open, setOpen] = useState(defaultOpen);
  const bodyId = useId();
  return (
    <section className="rounded-lg border border-nickel-200 bg-white shadow-sm" data-testid={testId}>
      <h2 className="text-h4">
        <button
          type="button"
          className="flex min-h-touch w-full items-center gap-3 rounded-lg px-5 py-3 text-left hover:bg-flux-50 sm:px-6"
          aria-expanded={open}
          aria-controls={bodyId}
          onClick={() => setOpen((o) => !o)}
        >
          <svg className={`size-5 shrink-0 text-flux-600 transition-transform ${open ? "rotate-90" : ""}`} viewBox="0 0 20 20" fill="none" stroke="currentColor" strokeWidth="2" aria-hidden="true">
            <path d="M7 4.5l6 5.5-6 5.5" strokeLinecap="round" strokeLinejoin="round" />
          </svg>
          <span className="flex min-w-0 flex-1 flex-wrap items-baseline justify-between gap-x-4 gap-y-0.5">
            <span>{title}</span>
            {digest && <span className="font-sans text-meta font-normal text-flux-600">{digest}</span>}
          </span>
        </button>
      </h2>
      <div id={bodyId} hidden={!open} className="border-t border-nickel-200 px-5 pb-5 pt-4 sm:px-6">
        {children}
      </div>
    </section>
  );
}
