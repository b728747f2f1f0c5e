import { useState, type FormEvent } from "react";
import { utcDay } from "../../../shared/quality/instruments";
import { calibrationRecordSchema, CERTIFICATE_ACCEPT, instrumentSendSchema } from "../../../shared/schemas/instrument";
import { ApiError } from "../../api/client";
import { useRecordCalibration, useReturnFromCalibration, useSendToCalibration, type InstrumentJson } from "../../api/instruments";
import { Button } from "../../components/ui/button";
import { control, FieldShell, TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";

type Problems = Record<string, string>;

/** A failed request: its field messages (for the boxes) and the rest as one sentence. */
function problemsOf(error: unknown, known: readonly string[]): { fields: Problems; message: string | null } {
  if (!(error instanceof ApiError)) return { fields: {}, message: "Something went wrong. Try again." };
  if (error.status !== 400) return { fields: {}, message: error.message };
  const fields: Problems = {};
  const strays: string[] = [];
  for (const [k, v] of Object.entries(error.fields)) {
    if (known.includes(k)) fields[k] = v;
    else strays.push(v);
  }
  return { fields, message: strays.length ? strays.join(" ") : Object.keys(fields).length ? null : error.message };
}

function issuesOf(result: { success: boolean; error?: { issues: Array<{ path: PropertyKey[]; message: string }> } }): Problems {
  const out: Problems = {};
  for (const issue of result.error?.issues ?? []) out[String(issue.path[0])] ??= issue.message;
  return out;
}

/**
 * Sending an instrument to the laboratory: where and when, then a confirmation (it cannot be used
 * for measurements until it is back with a new certificate).
 */
export function SendOutForm({ instrument, lastLaboratory, onDone }: { instrument: InstrumentJson; lastLaboratory: string | null; onDone: (message: string) => void }) {
  const send = useSendToCalibration();
  const [laboratory, setLaboratory] = useState(lastLaboratory ?? "");
  const [sentOn, setSentOn] = useState(utcDay(new Date()));
  const [note, setNote] = useState("");
  const [asking, setAsking] = useState(false);
  const [problems, setProblems] = useState<{ fields: Problems; message: string | null }>({ fields: {}, message: null });
  const body = { laboratory: laboratory.trim() || undefined, sentOn: sentOn || undefined, note: note.trim() || undefined };

  const ask = (e: FormEvent) => {
    e.preventDefault();
    const checked = instrumentSendSchema.safeParse(body);
    setProblems({ fields: issuesOf(checked), message: null });
    if (checked.success) setAsking(true);
  };
  const confirm = async () => {
    try {
      await send.mutateAsync({ id: instrument.id, ...body });
      setAsking(false);
      onDone(`${instrument.name} is out for calibration${body.laboratory ? ` at ${body.laboratory}` : ""}; it cannot be used in measurements until it is back.`);
    } catch (error) {
      setAsking(false);
      setProblems(problemsOf(error, ["laboratory", "sentOn", "note"]));
    }
  };

  return (
    <form onSubmit={ask} noValidate className="space-y-4" aria-label="Send out for calibration">
      {problems.message && <StatusNote tone="danger" word="Not sent" live="assertive">{problems.message}</StatusNote>}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Laboratory" value={laboratory} onChange={(e) => setLaboratory(e.target.value)} error={problems.fields.laboratory} />
        <TextField label="Sent on" type="date" value={sentOn} onChange={(e) => setSentOn(e.target.value)} error={problems.fields.sentOn} />
        <div className="sm:col-span-2">
          <TextField label="Note (optional)" value={note} onChange={(e) => setNote(e.target.value)} error={problems.fields.note} />
        </div>
      </div>
      {!asking && <Button type="submit" variant="secondary">Send out for calibration…</Button>}
      {asking && (
        <div className="space-y-3 rounded-md border border-caution-200 bg-caution-50 p-3" role="group" aria-label={`Confirm sending ${instrument.name} out`}>
          <p className="text-caution-900">
            Send {instrument.name} out{body.laboratory ? ` to ${body.laboratory}` : ""}? Until it is back with a new certificate it cannot be used in measurements.
          </p>
          <div className="flex flex-wrap gap-2">
            <Button pending={send.isPending} pendingLabel="Sending…" onClick={() => void confirm()}>Send it out</Button>
            <Button variant="secondary" onClick={() => setAsking(false)}>Keep it in service</Button>
          </div>
        </div>
      )}
    </form>
  );
}

const recordFields = ["calibratedOn", "calibrationDue", "laboratory", "certificateNumber", "file"] as const;

/**
 * A calibration with its certificate (a PDF or an image): back from the laboratory (`returning`)
 * or done in place. Both set the next due date.
 */
export function CalibrationRecordForm({ instrument, returning, lastLaboratory, onDone }: { instrument: InstrumentJson; returning: boolean; lastLaboratory: string | null; onDone: (message: string) => void }) {
  const back = useReturnFromCalibration();
  const inPlace = useRecordCalibration();
  const mutation = returning ? back : inPlace;
  const [calibratedOn, setCalibratedOn] = useState(utcDay(new Date()));
  const [calibrationDue, setCalibrationDue] = useState("");
  const [laboratory, setLaboratory] = useState(lastLaboratory ?? "");
  const [certificateNumber, setCertificateNumber] = useState("");
  const [file, setFile] = useState<File | null>(null);
  const [problems, setProblems] = useState<{ fields: Problems; message: string | null }>({ fields: {}, message: null });
  const what = returning ? "Back from calibration" : "Calibration recorded";

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    const record = { calibratedOn, calibrationDue, laboratory: laboratory.trim() || undefined, certificateNumber: certificateNumber.trim() || undefined };
    const checked = calibrationRecordSchema.safeParse(record);
    const fields = issuesOf(checked);
    if (!file) fields.file = "Choose the calibration certificate (PDF or image).";
    setProblems({ fields, message: null });
    if (!checked.success || !file) return;
    try {
      const saved = await mutation.mutateAsync({ id: instrument.id, record, file });
      onDone(`${what}: ${saved.name} is in service, calibrated until ${saved.calibrationDue}; the certificate ${file.name} is kept with it.`);
    } catch (error) {
      setProblems(problemsOf(error, recordFields));
    }
  };

  return (
    <form onSubmit={(e) => void submit(e)} noValidate className="space-y-4" aria-label={returning ? "Back from calibration" : "Record a calibration"}>
      {problems.message && <StatusNote tone="danger" word="Not recorded" live="assertive">{problems.message}</StatusNote>}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Calibrated on" type="date" value={calibratedOn} onChange={(e) => setCalibratedOn(e.target.value)} error={problems.fields.calibratedOn} />
        <TextField label="Next due" type="date" hint="The last day the new certificate covers" value={calibrationDue} onChange={(e) => setCalibrationDue(e.target.value)} error={problems.fields.calibrationDue} />
        <TextField label="Laboratory" value={laboratory} onChange={(e) => setLaboratory(e.target.value)} error={problems.fields.laboratory} />
        <TextField label="Certificate number" value={certificateNumber} onChange={(e) => setCertificateNumber(e.target.value)} error={problems.fields.certificateNumber} />
        <div className="sm:col-span-2">
          <FieldShell label="Certificate file" hint="PDF or image (PNG, JPEG, TIFF, WebP), up to 20 MB" error={problems.fields.file}>
            {({ id, describedBy, invalid }) => (
              <input
                id={id}
                type="file"
                accept={CERTIFICATE_ACCEPT}
                aria-invalid={invalid}
                aria-describedby={describedBy}
                className={`${control} border-nickel-400 file:mr-3 file:rounded file:border-0 file:bg-nickel-100 file:px-3 file:py-1 file:font-semibold file:text-flux-900`}
                onChange={(e) => setFile(e.target.files?.[0] ?? null)}
              />
            )}
          </FieldShell>
        </div>
      </div>
      <Button type="submit" pending={mutation.isPending} pendingLabel="Uploading…">
        {returning ? "Record it as back, with the certificate" : "Record the calibration"}
      </Button>
    </form>
  );
}
