import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { useState, type ReactNode } from "react";
import { Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { instrumentKindLabels, instrumentStatusLabels, type CalibrationRecordJson, type InstrumentDetailJson } from "../../shared/schemas/instrument";
import { certificateUrl, instrumentQueryOptions } from "../api/instruments";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { Button } from "../components/ui/button";
import { PageHeader, Panel } from "../components/ui/panel";
import { ResponsiveTable } from "../components/ui/responsive-table";
import { Loading } from "../components/ui/spinner";
import { StatusNote } from "../components/ui/status-note";
import { paths } from "../config/paths";
import { CalibrationRecordForm, SendOutForm } from "../features/instruments/calibration-actions";
import { CoilCaution } from "../features/instruments/coil-caution";
import { DueBadge } from "../features/instruments/due-badge";
import { figuresWords } from "../features/instruments/due-state";
import { InstrumentForm } from "../features/instruments/instrument-form";
import { formatDateTime } from "../lib/format";
import { requireRole, warmRecord } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request, params }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["qa", "admin"]);
  await warmRecord(queryClient.ensureQueryData(instrumentQueryOptions(params.id!)));
  return null;
};

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-meta text-flux-600">{term}</dt>
      <dd className="break-words">{children}</dd>
    </div>
  );
}

const kb = (bytes: number) => (bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} kB` : `${(bytes / 1024 / 1024).toFixed(1)} MB`);

type Action = "send" | "record" | null;

/** Where the instrument stands, its current certificate, and what may be done next. */
function CalibrationPanel({ i }: { i: InstrumentDetailJson }) {
  const [open, setOpen] = useState<Action>(null);
  const [outcome, setOutcome] = useState<string | null>(null);
  const done = (message: string) => {
    setOutcome(message);
    setOpen(null);
  };
  // the laboratory it is at, or the one that calibrated it last
  const lastLaboratory = i.calibrationLaboratory ?? i.calibrations.find((c) => c.laboratory)?.laboratory ?? null;
  const toggle = (action: Exclude<Action, null>) => {
    setOutcome(null);
    setOpen((o) => (o === action ? null : action));
  };
  return (
    <Panel title="Calibration">
      <div className="space-y-5">
        {outcome && (
          <StatusNote tone="ok" word="Recorded" live="polite">
            {outcome}
          </StatusNote>
        )}
        <DueBadge instrument={i} detail />
        <dl className="grid grid-cols-1 gap-x-6 gap-y-3 sm:grid-cols-2 lg:grid-cols-4">
          <Fact term="Status">{instrumentStatusLabels[i.status]}</Fact>
          <Fact term="Calibration due">
            <span className="font-mono">{i.calibrationDue}</span>
          </Fact>
          <Fact term="Last calibrated">{i.lastCalibratedOn ? <span className="font-mono">{i.lastCalibratedOn}</span> : "—"}</Fact>
          {i.status === "in-calibration" ? (
            <Fact term="Out since">
              {i.calibrationSentOn ? <span className="font-mono">{i.calibrationSentOn}</span> : "—"}
              {i.calibrationLaboratory ? `, ${i.calibrationLaboratory}` : ""}
            </Fact>
          ) : (
            <Fact term="Current certificate">
              {i.certificate ? (
                <a className="break-all underline" href={certificateUrl(i.id, i.certificate.id)} download>
                  {i.certificate.filename}
                </a>
              ) : (
                "none uploaded"
              )}
            </Fact>
          )}
        </dl>

        {i.abilities.returnFromCalibration && (
          <section className="space-y-3 border-t border-nickel-200 pt-4" aria-labelledby="back-heading">
            <h3 id="back-heading" className="font-semibold text-flux-900">Back from calibration</h3>
            <p className="text-meta text-flux-700">Upload the laboratory&apos;s new certificate and the next due date; the instrument goes back into service.</p>
            <CalibrationRecordForm instrument={i} returning lastLaboratory={lastLaboratory} onDone={done} />
          </section>
        )}

        {(i.abilities.sendToCalibration || i.abilities.recordCalibration) && (
          <div className="space-y-4 border-t border-nickel-200 pt-4">
            <div className="flex flex-wrap gap-3">
              {i.abilities.sendToCalibration && (
                <Button variant="secondary" aria-expanded={open === "send"} onClick={() => toggle("send")}>
                  Send out for calibration
                </Button>
              )}
              {i.abilities.recordCalibration && (
                <Button variant="secondary" aria-expanded={open === "record"} onClick={() => toggle("record")}>
                  Record a calibration done here
                </Button>
              )}
            </div>
            {open === "send" && (
              <section className="space-y-3 rounded-md border border-nickel-200 p-4" aria-labelledby="send-heading">
                <h3 id="send-heading" className="font-semibold text-flux-900">Send out for calibration</h3>
                <SendOutForm instrument={i} lastLaboratory={lastLaboratory} onDone={done} />
              </section>
            )}
            {open === "record" && (
              <section className="space-y-3 rounded-md border border-nickel-200 p-4" aria-labelledby="record-heading">
                <h3 id="record-heading" className="font-semibold text-flux-900">Record a calibration done here</h3>
                <p className="text-meta text-flux-700">A calibration done in place, with its certificate; it sets the next due date.</p>
                <CalibrationRecordForm instrument={i} returning={false} lastLaboratory={lastLaboratory} onDone={done} />
              </section>
            )}
          </div>
        )}
      </div>
    </Panel>
  );
}

function DetailsPanel({ i }: { i: InstrumentDetailJson }) {
  const [editing, setEditing] = useState(false);
  const [saved, setSaved] = useState(false);
  return (
    <Panel
      title="Details"
      actions={
        i.abilities.update && !editing ? (
          <Button variant="secondary" onClick={() => { setSaved(false); setEditing(true); }}>
            Correct the details
          </Button>
        ) : null
      }
    >
      <div className="space-y-4">
        {saved && (
          <StatusNote tone="ok" word="Saved" live="polite">
            The corrections are saved and recorded in the history.
          </StatusNote>
        )}
        {editing ? (
          <InstrumentForm instrument={i} onSaved={() => { setEditing(false); setSaved(true); }} onCancel={() => setEditing(false)} />
        ) : (
          <dl className="grid grid-cols-1 gap-x-6 gap-y-3 sm:grid-cols-2 lg:grid-cols-3">
            <Fact term="Kind">{instrumentKindLabels[i.kind]}</Fact>
            <Fact term="Serial number">{i.serialNumber ? <span className="font-mono">{i.serialNumber}</span> : "—"}</Fact>
            <Fact term="Make and model">{i.make ?? "—"}</Fact>
            <Fact term={i.kind === "search-coil" || i.kind === "helmholtz-coil" ? "Figures used in measurements" : "Range"}>{figuresWords(i)}</Fact>
            {(i.kind === "search-coil" || i.kind === "helmholtz-coil") && i.range && <Fact term="Range">{i.range}</Fact>}
            <Fact term="Notes">{i.notes ?? "—"}</Fact>
          </dl>
        )}
      </div>
    </Panel>
  );
}

function RecordsPanel({ i }: { i: InstrumentDetailJson }) {
  return (
    <Panel title="Calibration records">
      {i.calibrations.length === 0 ? (
        <p className="text-flux-700">No calibration recorded in the register yet.</p>
      ) : (
        <ResponsiveTable<CalibrationRecordJson>
          caption="Calibration records, newest first"
          testId="calibration-records"
          rowTestId="calibration-record"
          rows={i.calibrations}
          rowKey={(c) => c.id}
          cardsBelow={760}
          columns={[
            { key: "on", header: "Calibrated on", primary: true, className: "font-mono", cell: (c) => c.calibratedOn },
            { key: "due", header: "Due", className: "font-mono", cell: (c) => c.calibrationDue },
            { key: "lab", header: "Laboratory", cell: (c) => c.laboratory ?? "—" },
            { key: "number", header: "Certificate no.", className: "font-mono break-all", cell: (c) => c.certificateNumber ?? "—" },
            {
              key: "file",
              header: "Certificate",
              cell: (c) =>
                c.certificate ? (
                  <a className="break-all underline" href={certificateUrl(i.id, c.certificate.id)} download>
                    {c.certificate.filename}
                    <span className="sr-only"> (calibration of {c.calibratedOn})</span>
                  </a>
                ) : (
                  "not uploaded"
                ),
            },
            { key: "size", header: "Size", align: "end", className: "font-mono whitespace-nowrap", cell: (c) => (c.certificate ? kb(c.certificate.sizeBytes) : "—") },
            { key: "by", header: "Recorded by", cell: (c) => c.recordedBy?.name ?? "—" },
          ]}
        />
      )}
    </Panel>
  );
}

function HistoryPanel({ i }: { i: InstrumentDetailJson }) {
  return (
    <Panel title="History">
      {i.history.length === 0 ? (
        <p className="text-flux-700">Nothing recorded yet.</p>
      ) : (
        <ol className="space-y-2 border-l-2 border-nickel-300 pl-3" aria-label="History, newest first" data-testid="instrument-history">
          {i.history.map((h) => (
            <li key={`${h.at}-${h.action}`}>
              <span className="font-mono text-meta text-flux-600">{formatDateTime(h.at)}</span> <span className="font-semibold">{h.label}</span>
              {h.detail ? `: ${h.detail}` : ""}
              {h.actor ? <span className="text-flux-700"> · {h.actor.name}</span> : null}
            </li>
          ))}
        </ol>
      )}
    </Panel>
  );
}

export function Component() {
  const { id } = useParams();
  const query = useQuery(instrumentQueryOptions(id!));
  const i = query.data;
  const makesFields = i && (i.kind === "helmholtz-coil" || i.kind === "signal-source");
  return (
    <>
      <PageHeader
        eyebrow="Quality · instruments"
        title={i ? i.name : "Instrument"}
        lead={i ? `${instrumentKindLabels[i.kind]}${i.serialNumber ? `, serial ${i.serialNumber}` : ""}${i.make ? `: ${i.make}` : ""}.` : undefined}
      />
      <p className="mb-4">
        <Link className="underline" to={paths.instruments.href()}>
          Back to the register
        </Link>
      </p>
      {query.isPending && <Loading label="Loading the instrument…" />}
      {query.isError && <QueryError error={query.error} onRetry={() => void query.refetch()} what="the instrument" />}
      {i && (
        <div className="space-y-6">
          {makesFields && <CoilCaution />}
          <PanelBoundary name="the calibration">
            <CalibrationPanel i={i} />
          </PanelBoundary>
          <PanelBoundary name="the details">
            <DetailsPanel i={i} />
          </PanelBoundary>
          <RecordsPanel i={i} />
          <HistoryPanel i={i} />
        </div>
      )}
    </>
  );
}
