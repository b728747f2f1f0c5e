import type { ReactNode } from "react";
import { PageHeader } from "../../components/ui/panel";

/** The narrow column every sign-in style page sits in. */
export function AuthCard({ title, lead, children, footer }: { title: string; lead?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="mx-auto max-w-md">
      <PageHeader title={title} lead={lead} />
      <div className="rounded-lg border border-nickel-200 bg-white p-5 shadow-sm sm:p-6">{children}</div>
      {footer && <div className="mt-4 space-y-2 text-flux-700">{footer}</div>}
    </div>
  );
}
