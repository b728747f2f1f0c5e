import { useRef, useState, type FormEvent } from "react";
import { Link } from "react-router-dom";
import type { InstrumentJson } from "../../api/instruments";
import { blamesInputs, type ApiError } from "../../api/client";
import { useRecordMeasurement } from "../../api/quality";
import { Button } from "../../components/ui/button";
import { SelectField, TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";
import { quantityScale, unitOptions, UnitInput } from "../../components/ui/unit-input";
import { fieldUnits, type FieldUnit } from "../../../shared/units";
import type { LotQualityJson } from "../../../shared/schemas/quality";
import { paths } from "../../config/paths";
import { nextSerial } from "./serials";

const probeKinds = new Set(["fluxgate-probe", "gaussmeter-probe", "search-coil"]);

/**
 * One sampled part at a time, made for the keyboard: Enter records the reading, the serial moves
 * on to the next number and the cursor goes back to the inside field (the applied field, the
 * frequency and the instrument stay as they were for the whole sample).
 */
export function MeasureForm({ lot, instruments }: { lot: LotQualityJson; instruments: InstrumentJson[] }) {
  const usable = instruments.filter((i) => i.usable && probeKinds.has(i.kind));
  const [serial, setSerial] = useState(() => nextSerial(lot.measurements.filter((m) => m.round === lot.progress.round).map((m) => m.serial), lot.lot.number));
  const [applied, setApplied] = useState<number | null>(lot.lot.appliedField_uT || null);
  const [inside, setInside] = useState<number | null>(null);
  const [frequency, setFrequency] = useState<string>(String(lot.lot.frequency_hz));
  const [instrumentId, setInstrumentId] = useState(usable[0]?.id ?? "");
  const [appliedUnit, setAppliedUnit] = useState<FieldUnit>("uT");
  const [insideUnit, setInsideUnit] = useState<FieldUnit>("uT");
  const [last, setLast] = useState<string | null>(null);
  const insideRef = useRef<HTMLInputElement>(null);
  const record = useRecordMeasurement(lot.lot.id);
  const error = record.error as ApiError | null;
  const fields = error && blamesInputs(error) ? error.fields ?? {} : {};

  const submit = (e: FormEvent) => {
    e.preventDefault();
    record.mutate(
      { serial: serial.trim(), frequency_hz: Number(frequency), appliedField_uT: applied ?? Number.NaN, insideField_uT: inside ?? Number.NaN, instrumentId },
      {
        onSuccess: (answer) => {
          setLast(`${answer.measurement.serial}: ${answer.attenuation_db.toFixed(1)} dB, ${answer.pass ? "pass" : "FAIL"} (S = ${answer.shieldingFactor.toFixed(1)})`);
          setSerial(nextSerial([answer.measurement.serial], lot.lot.number));
          setInside(null);
          insideRef.current?.focus();
        },
      },
    );
  };
  const highField = (applied ?? 0) > 200;

  return (
    <form onSubmit={submit} className="space-y-4" aria-label="Record a reading" noValidate>
      <StatusNote tone="caution" word="Test coils">
        People with pacemakers or other implants keep out of the test area while the coils are energised. ICNIRP (2010) reference levels at 50/60 Hz: 1 mT for workers, 0.2 mT for the public.
        {highField && " The applied field set here is above the public level: keep visitors out of the area."}
      </StatusNote>
      {usable.length === 0 && <StatusNote tone="danger">No probe or search coil is in calibration: calibrate one on the <Link className="underline" to={paths.instruments.href()}>instruments register</Link> before measuring.</StatusNote>}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <TextField label="Serial" name="serial" value={serial} onChange={(e) => setSerial(e.target.value)} error={fields.serial} autoComplete="off" />
        <UnitInput label="Field inside" name="insideField" value={inside} onValueChange={setInside} inputRef={insideRef} scale={quantityScale("flux", insideUnit)} error={fields.insideField_uT}
          unitSelect={{ value: insideUnit, options: unitOptions.flux(fieldUnits), onChange: (u) => setInsideUnit(u as FieldUnit) }} />
        <UnitInput label="Applied field" name="appliedField" value={applied} onValueChange={setApplied} scale={quantityScale("flux", appliedUnit)} error={fields.appliedField_uT}
          unitSelect={{ value: appliedUnit, options: unitOptions.flux(fieldUnits), onChange: (u) => setAppliedUnit(u as FieldUnit) }} />
        <TextField label="Frequency (Hz)" name="frequency" inputMode="decimal" value={frequency} onChange={(e) => setFrequency(e.target.value)} error={fields.frequency_hz} />
        <SelectField label="Instrument" name="instrument" value={instrumentId} onChange={(e) => setInstrumentId(e.target.value)} error={fields.instrumentId}>
          {usable.map((i) => (
            <option key={i.id} value={i.id}>
              {i.name} (due {i.calibrationDue})
            </option>
          ))}
        </SelectField>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" pending={record.isPending} pendingLabel="Recording…" disabled={!usable.length}>Record reading</Button>
        <span className="text-meta text-flux-600">Enter records it; the next serial follows.</span>
      </div>
      {error && <StatusNote tone="danger" live="assertive">{error.message}</StatusNote>}
      {last && !error && <StatusNote tone="ok" live="polite" word="Recorded">{last}</StatusNote>}
    </form>
  );
}
