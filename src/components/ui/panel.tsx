import { useEffect, type ReactNode } from "react";

export function Panel({ title, children, actions, className = "" }: { title?: string; children: ReactNode; actions?: ReactNode; className?: string }) {
  return (
    <section className={`rounded-lg border border-nickel-200 bg-white p-5 shadow-sm sm:p-6 ${className}`}>
      {(title || actions) && (
        <div className="mb-4 flex flex-wrap items-center justify-between gap-3">
          {title && <h2 className="text-h4">{title}</h2>}
          {actions}
        </div>
      )}
      {children}
    </section>
  );
}

/** The page's one h1, which also names the browser tab. */
export function PageHeader({ title, lead, eyebrow }: { title: string; lead?: ReactNode; eyebrow?: string }) {
  useEffect(() => {
    document.title = `${title} · Fluxwright`;
  }, [title]);
  return (
    <header className="mb-6 space-y-2">
      {eyebrow && <p className="font-mono text-meta uppercase tracking-wider text-anneal-700">{eyebrow}</p>}
      <h1 className="text-h2 sm:text-h1">{title}</h1>
      {lead && <p className="max-w-prose text-lead text-flux-700">{lead}</p>}
    </header>
  );
}
