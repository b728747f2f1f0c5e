import { useState, type ReactNode } from "react";
import { get, type FieldErrors, type FieldValues, type Path, type UseFormRegister, type UseFormSetError } from "react-hook-form";
import { ApiError } from "../../api/client";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";

/** A number input bound to a (possibly nested) form path, with its own error beside it. */
export function NumberInput<T extends FieldValues>({ register, errors, name, label, step = "any" }: { register: UseFormRegister<T>; errors: FieldErrors<T>; name: Path<T>; label: string; step?: string }) {
  return <TextField label={label} type="number" step={step} inputMode="decimal" error={(get(errors, name) as { message?: string } | undefined)?.message} {...register(name, { valueAsNumber: true })} />;
}

/** The server names nested fields (materials.2.pricePerKg_cents); put each message on its input. */
export function showServerFields<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>): string | null {
  if (!(error instanceof ApiError)) return "Something went wrong. Try again.";
  const entries = Object.entries(error.fields);
  for (const [path, message] of entries) setError(path as Path<T>, { type: "server", message });
  return entries.length ? null : error.message;
}

/** Save asks once more, naming the version it will create, before anything is written. */
export function ConfirmSave({ nextVersion, pending, onConfirm, what }: { nextVersion: number; pending: boolean; onConfirm: () => void; what: string }): ReactNode {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button type="submit" onClick={(e) => { e.preventDefault(); setAsking(true); }}>
        Save {what}…
      </Button>
    );
  }
  return (
    <div className="space-y-3" role="group" aria-label="Confirm saving">
      <StatusNote tone="caution" word="Confirm">
        Saving makes version {nextVersion} the current list; new estimates and quotes are priced with it. Older quotes keep their version.
      </StatusNote>
      <div className="flex gap-3">
        <Button pending={pending} pendingLabel="Saving…" onClick={() => { onConfirm(); setAsking(false); }}>
          Save as version {nextVersion}
        </Button>
        <Button variant="secondary" onClick={() => setAsking(false)}>
          Cancel
        </Button>
      </div>
    </div>
  );
}
