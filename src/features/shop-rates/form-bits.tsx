import { useEffect, useRef, type ReactNode } from "react";
import { Controller, get, type Control, type FieldErrors, type FieldValues, type Path, type UseFormSetError } from "react-hook-form";
import { ApiError } from "../../api/client";
import type { MaterialRecord } from "../../api/materials";
import { Button } from "../../components/ui/button";
import { SelectField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";

const messageAt = <T extends FieldValues>(errors: FieldErrors<T>, name: Path<T>) => (get(errors, name) as { message?: string } | undefined)?.message;

/** A number of the shop rates through the one unit input (money in currency units, kept in cents). */
export { ControlledUnitInput as NumberInput } from "../../components/forms/controlled-unit-input";

/** A material chosen from the library (not typed): active ones by name, a retired one still listed when it is the value. */
export function MaterialSelect<T extends FieldValues>({ control, errors, name, label, materials, hideLabel }: { control: Control<T>; errors: FieldErrors<T>; name: Path<T>; label: string; materials: MaterialRecord[]; hideLabel?: boolean }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => {
        const value = (field.value as string) ?? "";
        const known = materials.some((m) => m.id === value);
        return (
          <SelectField label={label} hideLabel={hideLabel} name={field.name} ref={field.ref} value={value} onChange={(e) => field.onChange(e.target.value)} onBlur={field.onBlur} error={messageAt(errors, name)}>
            <option value="">Choose a material</option>
            {value && !known && <option value={value}>{value} (not in the library)</option>}
            {materials.map((m) => (
              <option key={m.id} value={m.id}>
                {m.id} · {m.name}
                {m.active ? "" : " (not in use)"}
              </option>
            ))}
          </SelectField>
        );
      }}
    />
  );
}

/** The server names nested fields (materials.2.pricePerKg_cents); put each message on its input. */
export function showServerFields<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>): string | null {
  if (!(error instanceof ApiError)) return "Something went wrong. Try again.";
  const entries = Object.entries(error.fields);
  for (const [path, message] of entries) setError(path as Path<T>, { type: "server", message });
  return entries.length ? null : error.message;
}

export type SaveMessage = { tone: "ok" | "danger"; text: string } | null;

/**
 * The foot of a shop-rates form: the values are checked first (the form's submit), then a second
 * step names the version the save will create; the outcome ("Saved as version 12", or what was
 * refused) appears right here, where the person pressed the button.
 */
export function SaveBar({ what, nextVersion, asking, pending, message, onConfirm, onCancel, extra }: { what: string; nextVersion: number; asking: boolean; pending: boolean; message: SaveMessage; onConfirm: () => void; onCancel: () => void; extra?: ReactNode }) {
  const confirmRef = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    if (asking) confirmRef.current?.focus();
  }, [asking]);
  return (
    <div className="space-y-3 border-t border-nickel-200 pt-4">
      {asking ? (
        <div className="space-y-3" role="group" aria-label="Confirm saving">
          <StatusNote tone="caution" word="Confirm">
            The values are checked. Saving makes version {nextVersion} the current list; new estimates and quotes are priced with it. Older quotes keep their version.
          </StatusNote>
          <div className="flex flex-wrap gap-3">
            <Button ref={confirmRef} pending={pending} pendingLabel="Saving…" onClick={onConfirm}>
              Save as version {nextVersion}
            </Button>
            <Button variant="secondary" onClick={onCancel}>
              Back to the values
            </Button>
          </div>
        </div>
      ) : (
        <div className="flex flex-wrap items-start gap-3">
          <Button type="submit">Save {what}…</Button>
          {extra}
        </div>
      )}
      {message && (
        <StatusNote tone={message.tone} word={message.tone === "ok" ? "Saved" : "Not saved"} live={message.tone === "ok" ? "polite" : "assertive"}>
          {message.text}
        </StatusNote>
      )}
    </div>
  );
}
