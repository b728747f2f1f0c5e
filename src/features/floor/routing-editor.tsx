import { useState, type FormEvent } from "react";
import type { JobJson } from "../../../shared/schemas/jobs";
import { stepKeys, stepLabels, type RoutingStep, type StepKey } from "../../../shared/shop-floor/routing";
import { ApiError } from "../../api/client";
import { useUpdateRouting } from "../../api/jobs";
import { Button } from "../../components/ui/button";
import { control } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";

interface Row {
  key: StepKey;
  on: boolean;
  drawStages: string;
  processAnneals: string;
  note: string;
}

const rowsOf = (job: JobJson): Row[] =>
  stepKeys.map((key) => {
    const s = job.steps.find((x) => x.key === key);
    return { key, on: Boolean(s), drawStages: s?.drawStages != null ? String(s.drawStages) : "", processAnneals: s?.processAnneals != null ? String(s.processAnneals) : "", note: s?.note ?? "" };
  });

/** The routing as the server takes it: the chosen steps in the trade's order, with their draws and notes. */
export function routingFromRows(rows: readonly Row[]): RoutingStep[] {
  return rows
    .filter((r) => r.on)
    .map((r) => ({
      key: r.key,
      ...(r.key === "form" && r.drawStages.trim() ? { drawStages: Number(r.drawStages) } : {}),
      ...(r.key === "form" && r.processAnneals.trim() ? { processAnneals: Number(r.processAnneals) } : {}),
      ...(r.note.trim() ? { note: r.note.trim() } : {}),
    }));
}

/** The planner changes a job's steps before work starts on it; the server checks the trade's order and says what is wrong. */
export function RoutingEditor({ job, onDone }: { job: JobJson; onDone: () => void }) {
  const [rows, setRows] = useState(() => rowsOf(job));
  const [saved, setSaved] = useState(false);
  const update = useUpdateRouting();
  const error = update.error instanceof ApiError ? update.error : null;
  const sent = routingFromRows(rows);
  const problemAt = (key: StepKey, field: string) => {
    const i = sent.findIndex((s) => s.key === key);
    return i >= 0 ? error?.fields[`steps.${i}.${field}`] : undefined;
  };
  const set = (i: number, patch: Partial<Row>) => setRows((rs) => rs.map((r, j) => (j === i ? { ...r, ...patch } : r)));
  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setSaved(false);
    try {
      await update.mutateAsync({ id: job.id, steps: sent });
      setSaved(true);
      onDone();
    } catch {
      // shown below
    }
  };
  return (
    <form onSubmit={submit} className="space-y-4" aria-label={`Routing of ${job.code}`} data-testid="routing-editor">
      <p className="text-flux-700">Steps run in the trade&rsquo;s order; tick the ones this job goes through. The traveler prints the notes beside each step.</p>
      <ol className="space-y-2">
        {rows.map((r, i) => (
          <li key={r.key} className={`grid gap-3 rounded-md border p-3 sm:grid-cols-[12rem_1fr] ${r.on ? "border-flux-300" : "border-nickel-200 bg-nickel-50"}`}>
            <label className="flex min-h-touch items-center gap-2 font-semibold">
              <input type="checkbox" className="size-5" checked={r.on} onChange={(e) => set(i, { on: e.target.checked })} />
              {stepLabels[r.key]}
            </label>
            {r.on && (
              <div className="grid gap-3 sm:grid-cols-3">
                {r.key === "form" && (
                  <>
                    <NumberBox label="Draw stages" value={r.drawStages} onChange={(v) => set(i, { drawStages: v })} error={problemAt(r.key, "drawStages")} />
                    <NumberBox label="Process anneals" value={r.processAnneals} onChange={(v) => set(i, { processAnneals: v })} error={problemAt(r.key, "processAnneals")} />
                  </>
                )}
                <div className={`space-y-1 ${r.key === "form" ? "" : "sm:col-span-3"}`}>
                  <label htmlFor={`note-${r.key}`} className="block text-meta font-semibold">
                    Note for {stepLabels[r.key].toLowerCase()}
                  </label>
                  <input id={`note-${r.key}`} value={r.note} maxLength={300} onChange={(e) => set(i, { note: e.target.value })} className={`${control} border-nickel-400`} />
                </div>
                {problemAt(r.key, "key") && <p className="text-meta font-semibold text-danger-700 sm:col-span-3">{problemAt(r.key, "key")}</p>}
              </div>
            )}
          </li>
        ))}
      </ol>
      {error && (
        <StatusNote tone="danger" word="Not saved" live="assertive">
          {error.fields.steps ?? error.message}
        </StatusNote>
      )}
      {saved && !update.isPending && (
        <StatusNote tone="ok" live="polite">
          Routing saved. Print the traveler again: the old one shows the old steps.
        </StatusNote>
      )}
      <div className="flex gap-3">
        <Button type="submit" pending={update.isPending} pendingLabel="Saving…">
          Save the routing
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Close
        </Button>
      </div>
    </form>
  );
}

function NumberBox({ label, value, onChange, error }: { label: string; value: string; onChange: (v: string) => void; error?: string }) {
  const id = `n-${label.replace(/\s+/g, "-").toLowerCase()}`;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-meta font-semibold">
        {label}
      </label>
      <input id={id} inputMode="numeric" value={value} onChange={(e) => onChange(e.target.value)} aria-invalid={Boolean(error)} className={`${control} tabular border-nickel-400 font-mono`} />
      {error && <p className="text-meta font-semibold text-danger-700">{error}</p>}
    </div>
  );
}
