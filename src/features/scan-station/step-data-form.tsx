import { useState, type FormEvent } from "react";
import type { JobJson } from "../../../shared/schemas/jobs";
import { stepLabels, type ScanAction, type StepKey } from "../../../shared/shop-floor/routing";
import { Button } from "../../components/ui/button";
import { control } from "../../components/ui/field";

/** The data a step's scan carries, as the station asks for it. */
export interface StepData {
  heatNumber?: string;
  drawStagesDone?: number;
  processAnnealsDone?: number;
  weldInspection?: { result: "pass" | "fail"; method: "visual" | "dye-penetrant" | "leak-test" };
}

export type DataNeed = "heat" | "draws" | "weld" | null;

/** Which step data a scan needs before it is sent (the server refuses the scan without it). */
export function dataNeeded(job: Pick<JobJson, "heat" | "steps">, step: StepKey, action: ScanAction): DataNeed {
  if (step === "material" && (action === "start" || !job.heat)) return "heat";
  if (step === "form" && action === "complete" && (job.steps.find((s) => s.key === "form")?.drawStages ?? 0) > 0) return "draws";
  if (step === "weld" && action === "complete") return "weld";
  return null;
}

const big = `${control} border-nickel-400 text-h4 min-h-14`;

/** Asks for the step's data in large controls; Enter records, Escape goes back to scanning. */
export function StepDataForm({ need, job, step, action, lastHeat, onRecord, onCancel }: {
  need: Exclude<DataNeed, null>;
  job: JobJson;
  step: StepKey;
  action: ScanAction;
  lastHeat?: string;
  onRecord: (data: StepData) => void;
  onCancel: () => void;
}) {
  const form = job.steps.find((s) => s.key === "form");
  const [heat, setHeat] = useState(lastHeat ?? job.heat?.heatNumber ?? "");
  const [draws, setDraws] = useState(String(form?.drawStages ?? ""));
  const [anneals, setAnneals] = useState(String(form?.processAnneals ?? 0));
  const [result, setResult] = useState<"pass" | "fail" | "">("");
  const [method, setMethod] = useState<"visual" | "dye-penetrant" | "leak-test">("visual");
  const [problem, setProblem] = useState<string | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (need === "heat") {
      if (!heat.trim()) return setProblem("Type or scan the heat number printed on the sheet.");
      return onRecord({ heatNumber: heat.trim() });
    }
    if (need === "draws") {
      const done = Number(draws);
      if (!Number.isInteger(done) || done < 0) return setProblem("Give the number of draws done as a whole number.");
      const annealsDone = Number(anneals);
      return onRecord({ drawStagesDone: done, ...(Number.isInteger(annealsDone) && annealsDone >= 0 ? { processAnnealsDone: annealsDone } : {}) });
    }
    if (!result) return setProblem("Choose the inspection result: pass or fail.");
    return onRecord({ weldInspection: { result, method } });
  };

  const title = `${action === "start" ? "Start" : "Complete"} ${stepLabels[step].toLowerCase()} on ${job.code}`;
  return (
    <form onSubmit={submit} onKeyDown={(e) => e.key === "Escape" && onCancel()} aria-label={title} className="space-y-4 rounded-lg border-2 border-anneal-500 bg-anneal-50 p-5" data-testid="step-data">
      <h2 className="text-h3">{title}</h2>
      {need === "heat" && (
        <div className="space-y-1.5">
          <label htmlFor="step-heat" className="block text-h4">
            Heat number on the sheet
          </label>
          <p className="text-flux-700">
            The sheet must be {job.part.materialName}, {job.part.thickness_mm} mm. The heat links this job to its mill certificate.
          </p>
          <input id="step-heat" className={`${big} font-mono uppercase`} value={heat} onChange={(e) => setHeat(e.target.value)} autoFocus autoComplete="off" />
        </div>
      )}
      {need === "draws" && (
        <div className="grid gap-4 sm:grid-cols-2">
          <div className="space-y-1.5">
            <label htmlFor="step-draws" className="block text-h4">
              Draws done
            </label>
            <p className="text-flux-700">{form?.drawStages} planned</p>
            <input id="step-draws" inputMode="numeric" className={`${big} tabular font-mono`} value={draws} onChange={(e) => setDraws(e.target.value)} autoFocus />
          </div>
          <div className="space-y-1.5">
            <label htmlFor="step-anneals" className="block text-h4">
              Process anneals done
            </label>
            <p className="text-flux-700">{form?.processAnneals ?? 0} planned</p>
            <input id="step-anneals" inputMode="numeric" className={`${big} tabular font-mono`} value={anneals} onChange={(e) => setAnneals(e.target.value)} />
          </div>
        </div>
      )}
      {need === "weld" && (
        <>
          <fieldset className="space-y-2">
            <legend className="text-h4">Weld inspection</legend>
            <div className="flex flex-wrap gap-3">
              {(["pass", "fail"] as const).map((r) => (
                <label key={r} className={`flex min-h-14 min-w-32 cursor-pointer items-center gap-3 rounded-md border-2 px-4 text-h4 ${result === r ? "border-flux-900 bg-white" : "border-nickel-300 bg-white/60"}`}>
                  <input type="radio" name="weld-result" value={r} checked={result === r} onChange={() => setResult(r)} className="size-6" />
                  {r === "pass" ? "Pass" : "Fail"}
                </label>
              ))}
            </div>
          </fieldset>
          <div className="space-y-1.5">
            <label htmlFor="step-weld-method" className="block font-semibold">
              Method
            </label>
            <select id="step-weld-method" className={big} value={method} onChange={(e) => setMethod(e.target.value as typeof method)}>
              <option value="visual">Visual</option>
              <option value="dye-penetrant">Dye penetrant</option>
              <option value="leak-test">Leak test</option>
            </select>
          </div>
        </>
      )}
      {problem && (
        <p role="alert" className="text-h4 font-semibold text-danger-700">
          {problem}
        </p>
      )}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" className="min-h-16 px-8 text-h4">
          Record {action}
        </Button>
        <Button variant="secondary" className="min-h-16 px-6 text-h4" onClick={onCancel}>
          Back to scanning
        </Button>
      </div>
    </form>
  );
}
