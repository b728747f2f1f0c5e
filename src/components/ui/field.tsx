import { useId, type ComponentProps, type ReactNode } from "react";

export const control =
  "block min-h-touch w-full rounded-md border bg-white px-3 py-2 text-body text-flux-950 " +
  "placeholder:text-nickel-600 aria-[invalid=true]:border-danger-700 aria-[invalid=true]:ring-1 aria-[invalid=true]:ring-danger-700";

interface FieldShellProps {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  /** the label is read out but not shown: a table of inputs names its columns once, in its header row */
  hideLabel?: boolean;
  children: (ids: { id: string; describedBy: string | undefined; invalid: boolean }) => ReactNode;
}

/** Label, hint and error wired to the control by id, so screen readers read all three. */
export function FieldShell({ label, error, hint, hideLabel = false, children }: FieldShellProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className={hideLabel ? "sr-only" : "block font-semibold text-flux-900"}>
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-meta text-flux-600">
          {hint}
        </p>
      )}
      {children({ id, describedBy, invalid: Boolean(error) })}
      {error && (
        <p id={errorId} className="flex items-center gap-1.5 text-meta font-semibold text-danger-700">
          <svg className="size-4 shrink-0" viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeWidth="2.4" strokeLinecap="round" aria-hidden="true">
            <circle cx="12" cy="12" r="9.5" strokeWidth="2" />
            <path d="M12 7.5v5.5M12 16.5v.5" />
          </svg>
          {error}
        </p>
      )}
    </div>
  );
}

interface TextFieldProps extends Omit<ComponentProps<"input">, "id"> {
  label: string;
  error?: string;
  hint?: ReactNode;
  hideLabel?: boolean;
}

export function TextField({ label, error, hint, hideLabel, className = "", ...input }: TextFieldProps) {
  return (
    <FieldShell label={label} error={error} hint={hint} hideLabel={hideLabel}>
      {({ id, describedBy, invalid }) => (
        <input
          id={id}
          aria-invalid={invalid}
          aria-describedby={describedBy}
          className={`${control} border-nickel-400 ${className}`}
          {...input}
        />
      )}
    </FieldShell>
  );
}

interface SelectFieldProps extends Omit<ComponentProps<"select">, "id"> {
  label: string;
  error?: string;
  hint?: ReactNode;
  hideLabel?: boolean;
}

export function SelectField({ label, error, hint, hideLabel, className = "", children, ...select }: SelectFieldProps) {
  return (
    <FieldShell label={label} error={error} hint={hint} hideLabel={hideLabel}>
      {({ id, describedBy, invalid }) => (
        <select
          id={id}
          aria-invalid={invalid}
          aria-describedby={describedBy}
          className={`${control} border-nickel-400 ${className}`}
          {...select}
        >
          {children}
        </select>
      )}
    </FieldShell>
  );
}
