import { useCallback, useEffect, useRef, useState, type FormEvent } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { AFTER_ANNEAL_CAUTION, HYDROGEN_CAUTION } from "../../../shared/shop-floor/anneal";
import { stepBarcode } from "../../../shared/shop-floor/codes";
import { stepLabels, type ScanAction, type StepKey } from "../../../shared/shop-floor/routing";
import { jobStatusLabels, type JobJson } from "../../../shared/schemas/jobs";
import { ApiError } from "../../api/client";
import { jobByCodeQueryOptions, jobKeys } from "../../api/jobs";
import { newScanKey } from "../../api/scans";
import { paths } from "../../config/paths";
import { formatDate, formatDateTime } from "../../lib/format";
import { Button } from "../../components/ui/button";
import { StatusNote } from "../../components/ui/status-note";
import { CameraScanner, cameraPossible } from "./camera-scanner";
import { dataNeeded, StepDataForm, type DataNeed, type StepData } from "./step-data-form";
import { actionForStep, movesJobOn, projectJob, readScannedText, stepCautions } from "./station-model";
import { useScanQueue, type Feedback } from "./use-scan-queue";

const STATION_KEY = "fluxwright.station";

interface Asking {
  need: Exclude<DataNeed, null>;
  job: JobJson;
  step: StepKey;
  action: ScanAction;
}

/**
 * The operator's station: one field that keeps the focus for a keyboard-wedge scanner (a code and
 * Enter), the camera when wanted, the job scanned with where it stands, and big start / complete
 * buttons. Scans queue on the device while the network is away.
 */
export function ScanStation() {
  const queryClient = useQueryClient();
  const [station, setStation] = useState(() => localStorage.getItem(STATION_KEY) || "Floor tablet 1");
  const [code, setCode] = useState("");
  const [text, setText] = useState("");
  const [feedback, setFeedback] = useState<Feedback | null>(null);
  const [asking, setAsking] = useState<Asking | null>(null);
  const [camera, setCamera] = useState(false);
  const [misread, setMisread] = useState<string | null>(null);
  const lastHeat = useRef<Record<string, string>>({});
  const field = useRef<HTMLInputElement>(null);

  // a queued scan the server refused must not scroll away under the next answer: kept until dismissed
  const [refusedFromQueue, setRefusedFromQueue] = useState<Array<Extract<Feedback, { kind: "refused" }>>>([]);
  const onFeedback = useCallback((f: Feedback) => {
    setFeedback(f);
    if (f.kind === "refused" && f.replayed) setRefusedFromQueue((list) => [...list, f]);
  }, []);
  const { queue, online, sending, submit } = useScanQueue(onFeedback);
  const job = useQuery({ ...jobByCodeQueryOptions(code), networkMode: "always" });
  const shown = job.data ?? null;
  const projection = shown ? projectJob(shown, queue) : null;

  useEffect(() => localStorage.setItem(STATION_KEY, station), [station]);

  const refocus = useCallback(() => {
    window.setTimeout(() => {
      const active = document.activeElement;
      if (!active || active === document.body) field.current?.focus();
    }, 0);
  }, []);

  const send = useCallback(
    async (jobCode: string, step: StepKey, action: ScanAction, data: StepData = {}) => {
      if (data.heatNumber) lastHeat.current[jobCode] = data.heatNumber;
      setAsking(null);
      await submit({ code: jobCode, step, action, station: station.trim() || "Station", idempotencyKey: newScanKey(station), ...data });
      refocus();
      field.current?.focus();
    },
    [refocus, station, submit],
  );

  /** A move on the job shown: ask for the step's data first when it needs some. */
  const move = useCallback(
    (target: JobJson, step: StepKey, action: ScanAction) => {
      const need = dataNeeded(target, step, action);
      if (need) setAsking({ need, job: target, step, action });
      else void send(target.code, step, action);
    },
    [send],
  );

  const onScanned = useCallback(
    (raw: string) => {
      setMisread(null);
      const read = readScannedText(raw);
      if (read.kind === "unreadable") {
        setMisread(read.text ? `“${read.text}” is not a job or step code. Job codes look like J-1042, step codes like J-1042-FORM.` : "Nothing was read. Scan again.");
        return;
      }
      setFeedback(null);
      setAsking(null);
      setCode(read.code);
      if (read.kind === "step") {
        const cached = queryClient.getQueryData<JobJson>(jobKeys.byCode(read.code));
        const projected = cached ? projectJob(cached, queue) : null;
        const action = actionForStep(projected, read.step);
        // a repeat or a scan out of turn goes as it is: the server answers "already recorded" or says why not
        if (cached && projected && movesJobOn(projected, read.step, action)) move(cached, read.step, action);
        else void send(read.code, read.step, action);
      }
    },
    [move, queryClient, queue, send],
  );

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const value = text;
    setText("");
    onScanned(value);
  };

  return (
    <div className="space-y-5" data-testid="scan-station">
      <StationBar station={station} onStation={setStation} online={online} queued={queue.length} sending={sending} />

      <form onSubmit={onSubmit} className="space-y-2" role="search" aria-label="Scan a code">
        <label htmlFor="scan-field" className="block font-display text-h3">
          Scan a traveler or type its code
        </label>
        <div className="flex flex-wrap gap-3">
          <input
            id="scan-field"
            ref={field}
            value={text}
            onChange={(e) => setText(e.target.value)}
            onBlur={refocus}
            autoFocus
            autoComplete="off"
            autoCapitalize="characters"
            spellCheck={false}
            enterKeyHint="go"
            placeholder="J-1042 or J-1042-FORM"
            aria-describedby="scan-help"
            className="min-h-16 min-w-0 flex-1 basis-72 rounded-lg border-2 border-flux-700 bg-white px-4 font-mono text-h3 uppercase tracking-wide text-flux-950 placeholder:text-nickel-600 focus:border-anneal-600 focus:outline-none focus:ring-4 focus:ring-anneal-200"
          />
          <Button type="submit" className="min-h-16 px-8 text-h4">
            Enter
          </Button>
          {cameraPossible() && (
            <Button variant="secondary" className="min-h-16 px-6 text-h4" aria-pressed={camera} onClick={() => setCamera((c) => !c)}>
              {camera ? "Close camera" : "Use camera"}
            </Button>
          )}
        </div>
        <p id="scan-help" className="text-flux-700">
          A hand scanner types the code and Enter into this field by itself. Scan the job&rsquo;s barcode to see it, then a step&rsquo;s barcode or the buttons below.
        </p>
        {misread && (
          <p role="alert" className="text-h4 font-semibold text-danger-700">
            {misread}
          </p>
        )}
      </form>

      {camera && <CameraScanner onCode={onScanned} />}

      {refusedFromQueue.length > 0 && (
        <div className="space-y-2" data-testid="queue-refusals">
          <StatusNote tone="danger" word="Sent from the queue but not recorded">
            <ul className="list-disc pl-5">
              {refusedFromQueue.map((f) => (
                <li key={f.scan.idempotencyKey}>
                  {f.scan.code} {f.scan.action} {stepLabels[f.scan.step as StepKey]?.toLowerCase() ?? f.scan.step}: {f.error.message}
                </li>
              ))}
            </ul>
          </StatusNote>
          <Button variant="secondary" onClick={() => setRefusedFromQueue([])}>
            Seen, dismiss
          </Button>
        </div>
      )}

      <div aria-live="polite" aria-atomic="true">
        {feedback && <FeedbackBanner feedback={feedback} />}
      </div>

      {asking && (
        <StepDataForm
          key={`${asking.job.code}-${asking.step}-${asking.action}`}
          need={asking.need}
          job={asking.job}
          step={asking.step}
          action={asking.action}
          lastHeat={lastHeat.current[asking.job.code]}
          onRecord={(data) => void send(asking.job.code, asking.step, asking.action, data)}
          onCancel={() => {
            setAsking(null);
            field.current?.focus();
          }}
        />
      )}

      {code && !shown && job.isPending && job.fetchStatus === "fetching" && <p className="text-h4 text-flux-700">Looking up {code}…</p>}
      {code && !shown && job.isError && <JobLookupProblem code={code} error={job.error} />}
      {shown && projection && <JobAtStation job={shown} projection={projection} onMove={move} />}
    </div>
  );
}

function StationBar({ station, onStation, online, queued, sending }: { station: string; onStation: (s: string) => void; online: boolean; queued: number; sending: boolean }) {
  const [fullscreen, setFullscreen] = useState(false);
  useEffect(() => {
    const on = () => setFullscreen(Boolean(document.fullscreenElement));
    document.addEventListener("fullscreenchange", on);
    return () => document.removeEventListener("fullscreenchange", on);
  }, []);
  return (
    <div className="flex flex-wrap items-end gap-4 rounded-lg bg-flux-900 p-4 text-white">
      <div className="min-w-0 flex-1 basis-56 space-y-1">
        <label htmlFor="station-name" className="block text-meta font-semibold uppercase tracking-wider text-flux-100">
          This station
        </label>
        <input
          id="station-name"
          value={station}
          maxLength={60}
          onChange={(e) => onStation(e.target.value)}
          className="min-h-touch w-full rounded-md border border-flux-500 bg-flux-800 px-3 font-semibold text-white"
        />
      </div>
      <p className="flex min-h-touch items-center gap-2 text-h4" data-testid="network-state">
        <span aria-hidden="true" className={`inline-block size-4 rounded-full ${online ? "bg-ok-200" : "bg-caution-200 ring-2 ring-caution-700"}`} />
        {online ? "Online" : "Offline"}
      </p>
      <p className={`flex min-h-touch items-center rounded-md px-3 text-h4 ${queued ? "bg-caution-50 text-caution-900" : "bg-flux-800 text-flux-100"}`} data-testid="queued-count" role="status">
        {queued === 0 ? "No scans waiting" : `${queued} ${queued === 1 ? "scan" : "scans"} waiting to send${sending ? " · sending…" : ""}`}
      </p>
      {typeof document !== "undefined" && document.fullscreenEnabled && (
        <Button variant="secondary" onClick={() => (fullscreen ? void document.exitFullscreen() : void document.documentElement.requestFullscreen())}>
          {fullscreen ? "Leave full screen" : "Full screen"}
        </Button>
      )}
    </div>
  );
}

function FeedbackBanner({ feedback }: { feedback: Feedback }) {
  const again = "replayed" in feedback && feedback.replayed ? " (sent from the queue)" : "";
  if (feedback.kind === "queued") {
    const s = feedback.scan;
    return (
      <StatusNote tone="caution" word="Waiting to send" className="text-h4">
        {s.action === "start" ? "Start" : "Completion"} of {stepLabels[s.step as StepKey]?.toLowerCase() ?? s.step} on {s.code} is kept on this device and will be sent when the network is back.
      </StatusNote>
    );
  }
  if (feedback.kind === "refused") {
    const e = feedback.error;
    const fields = Object.values(e.fields);
    return (
      <StatusNote tone="danger" word={e.status === 409 ? "Not recorded: out of turn" : e.status === 404 ? "Not recorded: unknown code" : "Not recorded"} className="text-h4" >
        <span data-testid="scan-refused">
          {feedback.scan.code}
          {again}: {e.message}
          {fields.length > 0 && ` ${fields.join(" ")}`}
        </span>
      </StatusNote>
    );
  }
  const { event, job } = feedback.answer;
  const what = `${event.action === "start" ? "Start" : "Completion"} of ${stepLabels[event.step].toLowerCase()} on ${job.code}`;
  return feedback.kind === "recorded" ? (
    <StatusNote tone="ok" word="Recorded" className="text-h4">
      <span data-testid="scan-recorded">
        {what}{again} at {formatDateTime(event.scannedAt)}.
      </span>
    </StatusNote>
  ) : (
    <StatusNote tone="info" word="Already recorded" className="text-h4">
      <span data-testid="scan-repeat">
        {what}{again} was recorded before, at {formatDateTime(event.scannedAt)}
        {event.operator ? ` by ${event.operator.name}` : ""}. Nothing new was added.
      </span>
    </StatusNote>
  );
}

function JobLookupProblem({ code, error }: { code: string; error: Error }) {
  if (error instanceof ApiError && error.status === 404) {
    return (
      <StatusNote tone="danger" word="Unknown code">
        No job {code}. Check the traveler, or ask the planner whether it has been released.
      </StatusNote>
    );
  }
  return (
    <StatusNote tone="caution" word="Not on this device">
      {code} could not be looked up{error instanceof ApiError && error.status === 0 ? " while offline" : ""}. Step scans are still kept and sent when the network is back.
    </StatusNote>
  );
}

const statusWords = { pending: "To do", started: "In work", completed: "Done" } as const;

function JobAtStation({ job, projection, onMove }: { job: JobJson; projection: ReturnType<typeof projectJob>; onMove: (job: JobJson, step: StepKey, action: ScanAction) => void }) {
  const next = projection.next;
  const cautions = next ? stepCautions(next.step, HYDROGEN_CAUTION, AFTER_ANNEAL_CAUTION) : [];
  return (
    <section aria-labelledby="station-job" className="space-y-4 rounded-lg border border-nickel-200 bg-white p-5 shadow-sm" data-testid="station-job">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h2 id="station-job" className="font-mono text-h2">
          {job.code}
        </h2>
        <p className="text-h4">
          {jobStatusLabels[job.status]}
          {job.late && <span className="ml-3 rounded bg-danger-700 px-2 py-0.5 text-white">Late</span>}
        </p>
      </div>
      <p className="text-lead">
        {job.part.description} · {job.part.quantity} pcs · {job.part.materialName} {job.part.thickness_mm} mm
      </p>
      <p className="text-flux-700">
        Lot <Link className="font-mono underline" to={paths.floorLot.href(job.lot.id)}>{job.lot.number}</Link> · order <span className="font-mono">{job.order.number}</span> · due {formatDate(job.dueDate)}
        {job.heat && <> · heat <span className="font-mono">{job.heat.heatNumber}</span></>}
      </p>
      {job.lot.onHold && (
        <StatusNote tone="danger" word="Lot on hold">
          {job.lot.holdReason ?? "The planner has stopped this lot."} Leave the parts where they are until the planner releases the lot.
        </StatusNote>
      )}
      {projection.pending > 0 && (
        <StatusNote tone="caution" word="Waiting to send">
          {projection.pending} {projection.pending === 1 ? "scan" : "scans"} of this job {projection.pending === 1 ? "is" : "are"} on this device only; shown here as done.
        </StatusNote>
      )}

      {next ? (
        <div className="space-y-3 rounded-lg bg-nickel-50 p-4" data-testid="next-move">
          <p className="text-h4">
            Next: <strong>{next.action === "start" ? "start" : "complete"} {stepLabels[next.step].toLowerCase()}</strong>
          </p>
          {next.step === "anneal" && (
            <p className="text-lead">{job.furnaceRun ? <>Furnace run <span className="font-mono">{job.furnaceRun.number}</span> holds this lot.</> : next.action === "complete" ? "The lot's furnace run has not been recorded yet: record the run first." : "The lot waits for a furnace load."}</p>
          )}
          {cautions.map((c) => (
            <StatusNote key={c} tone="caution">
              {c}
            </StatusNote>
          ))}
          {next.step === "verify" && next.action === "complete" ? (
            <p className="text-lead" data-testid="verify-by-quality">Verify completes by itself when quality accepts the lot from its measured sample: leave {job.code} with quality.</p>
          ) : (
            <Button className="min-h-20 w-full text-h3" disabled={!job.abilities.scan} onClick={() => onMove(job, next.step, next.action)}>
              {next.action === "start" ? "Start" : "Complete"} {stepLabels[next.step].toLowerCase()}
            </Button>
          )}
        </div>
      ) : (
        <StatusNote tone="ok" word="Finished">
          Every step of {job.code} is done.
        </StatusNote>
      )}

      <ol className="grid gap-2 sm:grid-cols-2" aria-label="Routing">
        {job.steps.map((s, i) => {
          const status = projection.statuses[i];
          return (
            <li key={s.key} className={`flex items-center justify-between gap-3 rounded-md border px-3 py-2 ${next?.step === s.key ? "border-anneal-600 bg-anneal-50" : "border-nickel-200"}`}>
              <span>
                <span className="font-semibold">{i + 1}. {s.label}</span>
                {s.drawStages ? <span className="text-flux-700"> · {s.drawStages} draws{s.processAnneals ? `, ${s.processAnneals} process anneal${s.processAnneals === 1 ? "" : "s"}` : ""}</span> : null}
                <span className="block font-mono text-meta text-flux-600">{stepBarcode(job.code, s.key)}</span>
              </span>
              <span className={`shrink-0 font-semibold ${status === "completed" ? "text-ok-700" : status === "started" ? "text-anneal-700" : "text-flux-600"}`}>{statusWords[status]}</span>
            </li>
          );
        })}
      </ol>
      <p>
        <Link to={paths.floorJob.href(job.id)} className="underline">
          The job&rsquo;s page and traveler
        </Link>
      </p>
    </section>
  );
}

