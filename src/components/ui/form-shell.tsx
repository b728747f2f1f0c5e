import type { FormEventHandler, ReactNode } from "react";
import { StatusNote } from "./status-note";

/** A form with the layout every form shares and its whole-form message (shown above the fields, read out at once). */
export function FormShell({ onSubmit, message, children }: { onSubmit: FormEventHandler<HTMLFormElement>; message: string | null | undefined; children: ReactNode }) {
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      {message && (
        <StatusNote tone="danger" live="assertive">
          {message}
        </StatusNote>
      )}
      {children}
    </form>
  );
}
