import type { ReactNode } from "react";
import { Controller, get, type Control, type FieldErrors, type FieldValues, type Path } from "react-hook-form";
import { UnitInput, type Scale } from "../ui/unit-input";

/**
 * A number of a react-hook-form form through the one unit input: the form keeps the canonical
 * value (cents, mm, Ω·m), the box shows it in its scale; an empty box is null and unreadable text
 * NaN, so the shared schema's message says what is wrong.
 */
export function ControlledUnitInput<T extends FieldValues>({ control, errors, name, label, scale, hideLabel, hint }: { control: Control<T>; errors: FieldErrors<T>; name: Path<T>; label: string; scale: Scale; hideLabel?: boolean; hint?: ReactNode }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => (
        <UnitInput
          label={label}
          hideLabel={hideLabel}
          hint={hint}
          name={field.name}
          inputRef={field.ref}
          scale={scale}
          value={field.value ?? null}
          onValueChange={(v) => field.onChange(v)}
          onBlur={field.onBlur}
          error={(get(errors, name) as { message?: string } | undefined)?.message}
        />
      )}
    />
  );
}
