import { useState } from "react";
import { useForm, type Path } from "react-hook-form";
import type { ZodType } from "zod";
import {
  instrumentCreateSchema, instrumentKindLabels, instrumentKinds, instrumentUpdateSchema, type InstrumentKind,
} from "../../../shared/schemas/instrument";
import { useCreateInstrument, useUpdateInstrument, type InstrumentJson } from "../../api/instruments";
import { ControlledUnitInput } from "../../components/forms/controlled-unit-input";
import { Button } from "../../components/ui/button";
import { SelectField, TextField } from "../../components/ui/field";
import { FormShell } from "../../components/ui/form-shell";
import { fixedUnitScale, plainScale, quantityScale } from "../../components/ui/unit-input";
import { useServerErrors } from "../../lib/use-server-errors";
import { CoilCaution } from "./coil-caution";

const squareMillimetres = fixedUnitScale("mm²", "square millimetres");
const millimetres = quantityScale("length", "mm");

interface Values {
  kind: InstrumentKind;
  name: string;
  serialNumber: string;
  make: string;
  range: string;
  turns: number | null;
  area_mm2: number | null;
  radius_mm: number | null;
  calibrationDue: string;
  lastCalibratedOn: string;
  notes: string;
}
const fields: Array<Path<Values>> = ["kind", "name", "serialNumber", "make", "range", "turns", "area_mm2", "radius_mm", "calibrationDue", "lastCalibratedOn", "notes"];

/** Which figures each kind carries for the arithmetic (turns, area, radius); every kind may state its range in words. */
export const kindFields: Record<InstrumentKind, { turns?: string; area?: boolean; radius?: boolean }> = {
  "fluxgate-probe": {},
  "gaussmeter-probe": {},
  "search-coil": { turns: "Turns", area: true },
  "helmholtz-coil": { turns: "Turns on each coil", radius: true },
  "signal-source": {},
};

const blank: Values = { kind: "search-coil", name: "", serialNumber: "", make: "", range: "", turns: null, area_mm2: null, radius_mm: null, calibrationDue: "", lastCalibratedOn: "", notes: "" };

const fromInstrument = (i: InstrumentJson): Values => ({
  kind: i.kind, name: i.name, serialNumber: i.serialNumber ?? "", make: i.make ?? "", range: i.range ?? "", turns: i.turns, area_mm2: i.area_mm2, radius_mm: i.radius_mm,
  calibrationDue: i.calibrationDue, lastCalibratedOn: i.lastCalibratedOn ?? "", notes: i.notes ?? "",
});

/** A new instrument's body: what is empty, or not asked of its kind, is left out. */
function createBody(v: Values): Record<string, unknown> {
  const shown = kindFields[v.kind];
  const text = (s: string) => s.trim() || undefined;
  return {
    kind: v.kind,
    name: v.name.trim(),
    serialNumber: text(v.serialNumber),
    make: text(v.make),
    range: text(v.range),
    turns: shown.turns ? (v.turns ?? undefined) : undefined,
    area_mm2: shown.area ? (v.area_mm2 ?? undefined) : undefined,
    radius_mm: shown.radius ? (v.radius_mm ?? undefined) : undefined,
    notes: text(v.notes),
    calibrationDue: v.calibrationDue || undefined,
    lastCalibratedOn: v.lastCalibratedOn || undefined,
  };
}

/** A correction's body: only what differs from the instrument as it was; an emptied box is sent as null (cleared). */
function correctionBody(v: Values, before: InstrumentJson): Record<string, unknown> {
  const now: Record<string, unknown> = {
    name: v.name.trim(),
    serialNumber: v.serialNumber.trim() || null,
    make: v.make.trim() || null,
    range: v.range.trim() || null,
    turns: v.turns,
    area_mm2: v.area_mm2,
    radius_mm: v.radius_mm,
    notes: v.notes.trim() || null,
    calibrationDue: v.calibrationDue || undefined,
  };
  const was = before as unknown as Record<string, unknown>;
  return Object.fromEntries(Object.entries(now).filter(([k, x]) => x !== undefined && x !== was[k]));
}

/**
 * A new instrument for the register, or a correction of one's details. The figures asked for follow
 * the kind; checked with the server's own schema before sending, and the server's field errors are
 * shown beside the same boxes.
 */
export function InstrumentForm({ instrument, onSaved, onCancel }: { instrument?: InstrumentJson; onSaved: (saved: InstrumentJson) => void; onCancel?: () => void }) {
  const editing = Boolean(instrument);
  const create = useCreateInstrument();
  const update = useUpdateInstrument();
  const [busy, setBusy] = useState(false);
  const [unchanged, setUnchanged] = useState(false);
  const { register, control, handleSubmit, setError, watch, formState: { errors } } = useForm<Values>({ defaultValues: instrument ? fromInstrument(instrument) : blank });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, fields);
  const kind = watch("kind");
  const shown = kindFields[kind];

  const onSubmit = handleSubmit(async (values) => {
    clearFormMessage();
    setUnchanged(false);
    const body = instrument ? correctionBody(values, instrument) : createBody(values);
    if (instrument && Object.keys(body).length === 0) {
      setUnchanged(true);
      return;
    }
    const schema: ZodType = editing ? instrumentUpdateSchema : instrumentCreateSchema;
    const checked = schema.safeParse(body);
    if (!checked.success) {
      const named = new Set<string>();
      for (const issue of checked.error.issues) {
        const field = fields.find((f) => f === issue.path[0]);
        if (field && !named.has(field)) {
          setError(field, { type: "schema", message: issue.message }, { shouldFocus: named.size === 0 });
          named.add(field);
        }
      }
      return;
    }
    setBusy(true);
    try {
      const saved = instrument ? await update.mutateAsync({ id: instrument.id, ...(checked.data as object) }) : await create.mutateAsync(checked.data as never);
      onSaved(saved);
    } catch (error) {
      showServerError(error);
    } finally {
      setBusy(false);
    }
  });

  return (
    <FormShell onSubmit={onSubmit} message={formMessage ?? (unchanged ? "Nothing was changed: edit a box first, or cancel." : null)}>
      <div className="grid gap-5 sm:grid-cols-2">
        {!editing && (
          <SelectField label="Kind" error={errors.kind?.message} {...register("kind")}>
            {instrumentKinds.map((k) => (
              <option key={k} value={k}>
                {instrumentKindLabels[k]}
              </option>
            ))}
          </SelectField>
        )}
        <TextField label="Name" hint="As the readings and the CSV name it, e.g. Search coil SC-300" error={errors.name?.message} {...register("name")} />
        {shown.turns && <ControlledUnitInput control={control} errors={errors} name="turns" label={shown.turns} scale={plainScale} />}
        {shown.area && <ControlledUnitInput control={control} errors={errors} name="area_mm2" label="Area of one turn" scale={squareMillimetres} hint="The mean area the turns enclose" />}
        {shown.radius && <ControlledUnitInput control={control} errors={errors} name="radius_mm" label="Coil radius" scale={millimetres} hint="Equal to the spacing of the pair" />}
        <TextField label="Serial number (optional)" error={errors.serialNumber?.message} {...register("serialNumber")} />
        <TextField label="Make and model (optional)" error={errors.make?.message} {...register("make")} />
        <TextField label="Range (optional)" hint="What it covers, in words: ±100 µT, DC to 1 kHz" error={errors.range?.message} {...register("range")} />
        <TextField label={editing ? "Calibration due (a correction)" : "Calibration due"} type="date" hint="The last day the current certificate covers" error={errors.calibrationDue?.message} {...register("calibrationDue")} />
        {!editing && <TextField label="Last calibrated on (optional)" type="date" error={errors.lastCalibratedOn?.message} {...register("lastCalibratedOn")} />}
        <div className="sm:col-span-2">
          <TextField label="Notes (optional)" error={errors.notes?.message} {...register("notes")} />
        </div>
      </div>
      {kind === "helmholtz-coil" && <CoilCaution />}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" pending={busy} pendingLabel="Saving…">
          {editing ? "Save the corrections" : "Add to the register"}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </FormShell>
  );
}
