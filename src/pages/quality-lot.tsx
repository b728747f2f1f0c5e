import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { instrumentsQueryOptions } from "../api/instruments";
import type { ApiError } from "../api/client";
import { lotQualityQueryOptions, useIssueCertificate, useReviseCertificate, type LotQualityJson } from "../api/quality";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { Button } from "../components/ui/button";
import { TextField } from "../components/ui/field";
import { PageHeader, Panel } from "../components/ui/panel";
import { ResponsiveTable } from "../components/ui/responsive-table";
import { Loading } from "../components/ui/spinner";
import { StatusNote } from "../components/ui/status-note";
import { paths } from "../config/paths";
import { CsvUpload } from "../features/quality/csv-upload";
import { NonconformanceForm } from "../features/quality/decide-panel";
import { MeasureForm } from "../features/quality/measure-form";
import { requireRole, warm } from "../lib/guards";
import type { MeasurementJson } from "../../shared/schemas/quality";

export const makeLoader = (queryClient: QueryClient) => async ({ request, params }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["qa", "admin"]);
  await warm(queryClient.ensureQueryData(lotQualityQueryOptions(params.id!)), queryClient.ensureQueryData(instrumentsQueryOptions()));
  return null;
};

const db = (x: number | null) => (x === null ? "—" : `${x.toFixed(1)} dB`);

function PlanPanel({ q }: { q: LotQualityJson }) {
  const p = q.plan;
  return (
    <Panel title="Sampling plan">
      {!p && <StatusNote tone="danger">{q.switching.reason}</StatusNote>}
      {p && (
        <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-body sm:grid-cols-4" data-testid="sampling-plan">
          <div><dt className="text-meta text-flux-600">Lot size</dt><dd className="font-mono">{p.lotSize}</dd></div>
          <div><dt className="text-meta text-flux-600">AQL</dt><dd className="font-mono">{p.aql}</dd></div>
          <div><dt className="text-meta text-flux-600">Code letter</dt><dd className="font-mono">{p.codeLetter}{p.planCodeLetter !== p.codeLetter ? ` → ${p.planCodeLetter}` : ""}</dd></div>
          <div><dt className="text-meta text-flux-600">Sample</dt><dd className="font-mono">{p.sampleSize}{p.everyPart ? " (every part)" : ""}</dd></div>
          <div><dt className="text-meta text-flux-600">Accept with</dt><dd className="font-mono">≤ {p.accept} failing</dd></div>
          <div><dt className="text-meta text-flux-600">Reject with</dt><dd className="font-mono">≥ {p.reject} failing</dd></div>
          <div className="col-span-2"><dt className="text-meta text-flux-600">Inspection</dt><dd>{p.inspection}: {q.switching.reason}</dd></div>
        </dl>
      )}
      {p && <p className="mt-3 text-meta text-flux-600">{p.standard}. {p.note}</p>}
    </Panel>
  );
}

function Progress({ q }: { q: LotQualityJson }) {
  const { measured, sampleSize, failures, decision } = q.progress;
  const pct = sampleSize ? Math.min(100, Math.round((measured / sampleSize) * 100)) : 0;
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="font-semibold text-flux-900" data-testid="sample-progress">{measured} of {sampleSize} measured{failures ? `, ${failures} failing` : ""}</p>
        {decision && <p className={`font-semibold ${decision === "accepted" ? "text-flux-900" : "text-danger-700"}`} data-testid="lot-decision">Lot {decision}</p>}
      </div>
      <div className="h-2 w-full rounded bg-nickel-200" role="progressbar" aria-label="Sample measured" aria-valuemin={0} aria-valuemax={sampleSize} aria-valuenow={measured}>
        <div className="h-2 rounded bg-flux-800" style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}

function CertificatePanel({ q }: { q: LotQualityJson }) {
  const issue = useIssueCertificate(q.lot.id);
  const revise = useReviseCertificate(q.lot.id);
  const [reason, setReason] = useState("");
  const current = q.certificates.find((c) => c.current);
  const issueError = issue.error as ApiError | null;
  const reviseError = revise.error as ApiError | null;
  return (
    <Panel title="Certificate of conformance">
      {q.certificates.length === 0 && !q.certifiable && <p className="text-flux-700">A certificate can be issued once the lot is accepted under its plan and every job has completed verify.</p>}
      {q.certifiable && q.abilities.certify && (
        <div className="space-y-2">
          <Button onClick={() => issue.mutate()} pending={issue.isPending} pendingLabel="Issuing…">Issue the certificate</Button>
          <p className="text-meta text-flux-600">Issued certificates never change; a correction is a new revision. The customer gets it by mail.</p>
        </div>
      )}
      {issueError && <StatusNote tone="danger" live="assertive">{issueError.message}</StatusNote>}
      {issue.data && <StatusNote tone="ok" live="polite" word="Issued">The certificate is issued and mailed to the customer.</StatusNote>}
      {q.certificates.length > 0 && (
        <ul className="space-y-2" data-testid="certificates">
          {q.certificates.map((c) => (
            <li key={c.id} className="rounded border border-nickel-300 p-3">
              <p className="font-semibold">{c.number} revision {c.revision} · {c.current ? "current" : `superseded by revision ${c.supersededBy?.revision}`}</p>
              {c.revisionReason && <p className="text-meta">Correction: {c.revisionReason}</p>}
              <p className="break-all font-mono text-meta">SHA-256 {c.digest}</p>
              <p className="flex flex-wrap gap-4">
                <a className="underline" href={c.pdfUrl}>Download PDF<span className="sr-only"> of {c.number} revision {c.revision}</span></a>
                <Link className="underline" to={c.verifyUrl}>Public check<span className="sr-only"> of {c.number} revision {c.revision}</span></Link>
              </p>
            </li>
          ))}
        </ul>
      )}
      {current && q.abilities.certify && (
        <form className="mt-4 space-y-2" onSubmit={(e) => { e.preventDefault(); revise.mutate({ id: current.id, reason }); }} aria-label="Issue a revision">
          <TextField label="Correction (issues a new revision)" value={reason} onChange={(e) => setReason(e.target.value)} error={reviseError?.fields?.reason} />
          <Button type="submit" variant="secondary" pending={revise.isPending} pendingLabel="Issuing…">Issue a revision</Button>
          {reviseError && <StatusNote tone="danger" live="assertive">{reviseError.message}</StatusNote>}
        </form>
      )}
    </Panel>
  );
}

export function Component() {
  const { id } = useParams();
  const lot = useQuery(lotQualityQueryOptions(id!));
  const instruments = useQuery(instrumentsQueryOptions());
  const q = lot.data;
  const openNc = q?.nonconformances.find((n) => n.status === "open");
  const canMeasure = q && q.abilities.measure && q.lot.annealed && !q.progress.decision && !q.lot.holdReason && q.plan;
  return (
    <>
      <PageHeader eyebrow="Lot inspection" title={q ? `Lot ${q.lot.number}` : "Lot"} lead={q ? `${q.lot.customer}, ${q.lot.order.number}: ${q.lot.pieces} pieces of ${q.lot.material}, ${q.lot.method}. Required ${q.lot.order.requiredAttenuation_db} dB; predicted ${db(q.lot.predicted_db)} (an estimate).` : undefined} />
      <p className="mb-4"><Link className="underline" to={paths.qualityLots.href()}>Back to the lots</Link></p>
      {lot.isPending && <Loading label="Loading the lot…" />}
      {lot.isError && <QueryError error={lot.error} onRetry={() => void lot.refetch()} what="the lot" />}
      {q && (
        <div className="space-y-6">
          <PlanPanel q={q} />
          <Panel title={`Measurements, round ${q.progress.round}`}>
            <div className="space-y-6">
              <Progress q={q} />
              {q.lot.notAnnealedReason && <StatusNote tone="info">{q.lot.notAnnealedReason}</StatusNote>}
              {q.lot.holdReason && <StatusNote tone="caution" word="On hold">{q.lot.holdReason}</StatusNote>}
              {canMeasure && instruments.data && (
                <PanelBoundary name="the reading form">
                  <MeasureForm lot={q} instruments={instruments.data} />
                </PanelBoundary>
              )}
              {canMeasure && <CsvUpload lotId={q.lot.id} />}
              {q.measurements.length > 0 && (
                <ResponsiveTable<MeasurementJson>
                  caption="Readings"
                  testId="readings"
                  rowTestId="reading-row"
                  rows={q.measurements}
                  rowKey={(m) => m.id}
                  cardsBelow={760}
                  columns={[
                    { key: "serial", header: "Serial", primary: true, className: "font-mono", cell: (m) => `${m.serial}${m.round !== q.progress.round ? ` (round ${m.round})` : ""}` },
                    { key: "applied", header: "Applied", align: "end", className: "font-mono", cell: (m) => `${+m.appliedField_uT.toPrecision(4)} µT` },
                    { key: "inside", header: "Inside", align: "end", className: "font-mono", cell: (m) => `${+m.insideField_uT.toPrecision(4)} µT` },
                    { key: "db", header: "Attenuation", align: "end", className: "font-mono", cell: (m) => db(m.attenuation_db) },
                    { key: "pass", header: "Result", cell: (m) => (m.pass ? "pass" : "FAIL") },
                    { key: "instrument", header: "Instrument", cell: (m) => m.instrument.name },
                  ]}
                />
              )}
            </div>
          </Panel>
          {openNc && q.abilities.decide && (
            <Panel title={`Nonconformance ${openNc.number}`}>
              <NonconformanceForm lotId={q.lot.id} nc={openNc} />
            </Panel>
          )}
          {q.nonconformances.filter((n) => n.status === "closed").map((n) => (
            <Panel key={n.id} title={`Nonconformance ${n.number} (closed)`}>
              <p>{n.description}</p>
              <p>Cause: {n.cause}. Disposition: {n.disposition}{n.customerConsent ? ` (consent: ${n.customerConsent})` : ""}.</p>
              <ul className="mt-2 list-disc pl-5 text-meta">
                {n.trail.map((t) => <li key={t.at + t.action}>{t.at.slice(0, 16).replace("T", " ")} {t.action} by {t.by ?? "the system"}</li>)}
              </ul>
            </Panel>
          ))}
          <CertificatePanel q={q} />
        </div>
      )}
    </>
  );
}
