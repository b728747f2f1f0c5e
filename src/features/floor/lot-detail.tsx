import { useState, type FormEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { lotStatusLabels, type JobSummaryJson, type LotJson } from "../../../shared/schemas/jobs";
import { stepLabels } from "../../../shared/shop-floor/routing";
import { ApiError } from "../../api/client";
import { millCertificateUrl } from "../../api/heats";
import { lotLabelPdfUrl, lotQueryOptions, lotTravelersPdfUrl, useHoldLot, useReleaseLotHold } from "../../api/jobs";
import { paths } from "../../config/paths";
import { formatDate, formatDateTime } from "../../lib/format";
import { Button } from "../../components/ui/button";
import { control } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Loading } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { LateMark } from "./late-mark";
import { PrintLinks } from "./print-links";

export function LotDetail({ id }: { id: string }) {
  const lot = useQuery(lotQueryOptions(id));
  if (lot.isPending) return <Loading label="Loading the lot…" />;
  if (lot.isError) return <QueryError error={lot.error} onRetry={() => lot.refetch()} what="the lot" />;
  const l = lot.data;
  return (
    <div className="space-y-6">
      {l.hold && (
        <StatusNote tone="danger" word="On hold">
          <span data-testid="hold-reason">{l.hold.reason}</span>
          <span className="block text-meta">
            Since {formatDateTime(l.hold.at)}
            {l.hold.by ? ` · ${l.hold.by.name}` : ""}
          </span>
        </StatusNote>
      )}
      <Panel>
        <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-2 lg:grid-cols-3">
          <Item term="State">
            {lotStatusLabels[l.status]}
            <LateMark late={l.late} />
          </Item>
          <Item term="Order">
            <span className="font-mono">{l.order.number}</span> · {l.order.organization.name}
          </Item>
          <Item term="Alloy">{l.material.name}</Item>
          <Item term="Pieces">{l.pieces}</Item>
          <Item term="Furnace load">{l.mass_kg.toFixed(1)} kg</Item>
          <Item term="Due">{formatDate(l.dueDate)}</Item>
          <Item term="Furnace run">{l.furnaceRun ? <><span className="font-mono">{l.furnaceRun.number}</span> {l.furnaceRun.withinWindow ? "(inside the window)" : "(outside the window)"}</> : "not yet"}</Item>
          {l.shipment && <Item term="Shipped">{formatDate(l.shipment.shippedAt)} · {l.shipment.carrier} <span className="font-mono">{l.shipment.trackingNumber}</span></Item>}
        </dl>
        {l.abilities.label && (
          <div className="mt-5 flex flex-wrap gap-2">
            <PrintLinks what="Lot label" url={(paper) => lotLabelPdfUrl(l.id, paper)} testId="label-links" />
            <PrintLinks what="All travelers" url={(paper) => lotTravelersPdfUrl(l.id, paper)} />
          </div>
        )}
      </Panel>
      {(l.abilities.releaseHold || l.abilities.hold) && <HoldPanel lot={l} />}
      <Panel title="Jobs">
        <ResponsiveTable<JobSummaryJson>
          caption={`Jobs in lot ${l.number}`}
          rows={l.jobs}
          rowKey={(j) => j.id}
          testId="lot-jobs"
          cardsBelow={620}
          columns={[
            { key: "code", header: "Job", primary: true, cell: (j) => <><Link className="font-mono font-semibold underline" to={paths.floorJob.href(j.id)}>{j.code}</Link><LateMark late={j.late} /></> },
            { key: "part", header: "Part", cell: (j) => `${j.description} × ${j.quantity}` },
            { key: "step", header: "Step", cell: (j) => (j.step ? `${stepLabels[j.step]}${j.stepStarted ? " (in work)" : ""}` : "done") },
          ]}
        />
      </Panel>
      <Panel title="Material heats">
        {l.heats.length === 0 ? (
          <p className="text-flux-700">No material issued yet.</p>
        ) : (
          <ul className="space-y-2">
            {l.heats.map((h) => (
              <li key={h.id}>
                <span className="font-mono font-semibold">{h.heatNumber}</span> · {h.supplier} · {h.thickness_mm} mm ·{" "}
                {h.millCertificate ? (
                  <a className="underline" href={millCertificateUrl(h.id)} target="_blank" rel="noopener">
                    mill certificate
                  </a>
                ) : (
                  <span className="text-caution-700">no mill certificate yet</span>
                )}
              </li>
            ))}
          </ul>
        )}
      </Panel>
    </div>
  );
}

/** Hold a lot, or release its hold: a reason, then a confirmation that says what will happen. */
function HoldPanel({ lot }: { lot: LotJson }) {
  const hold = useHoldLot();
  const release = useReleaseLotHold();
  const [reason, setReason] = useState("");
  const [reanneal, setReanneal] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [done, setDone] = useState<string | null>(null);
  const releasing = Boolean(lot.hold);
  const mutation = releasing ? release : hold;
  const error = mutation.error instanceof ApiError ? mutation.error : null;
  const ask = (e: FormEvent) => {
    e.preventDefault();
    setDone(null);
    if (reason.trim().length < 3) return;
    setConfirming(true);
  };
  const go = async () => {
    try {
      if (releasing) await release.mutateAsync({ id: lot.id, reason: reason.trim(), reanneal });
      else await hold.mutateAsync({ id: lot.id, reason: reason.trim() });
      setDone(releasing ? (reanneal ? `Lot ${lot.number} goes back to wait for another furnace load.` : `Lot ${lot.number} is released; its jobs can be scanned again.`) : `Lot ${lot.number} is on hold.`);
      setReason("");
      setReanneal(false);
    } catch {
      // shown below
    } finally {
      setConfirming(false);
    }
  };
  if (releasing && !lot.abilities.releaseHold) return null;
  if (!releasing && !lot.abilities.hold) return null;
  return (
    <Panel title={releasing ? "Release the hold" : "Stop this lot"}>
      <form onSubmit={ask} className="space-y-3" data-testid="hold-form">
        <div className="space-y-1.5">
          <label htmlFor="hold-reason-input" className="block font-semibold">
            {releasing ? "Why the lot may go on (kept in the trail and on the certificate record)" : "Why the lot stops"}
          </label>
          <textarea id="hold-reason-input" rows={3} value={reason} onChange={(e) => setReason(e.target.value)} className={`${control} border-nickel-400`} aria-invalid={Boolean(error?.fields.reason)} />
          {(error?.fields.reason || (reason && reason.trim().length < 3)) && <p className="text-meta font-semibold text-danger-700">{error?.fields.reason ?? "Give the reason (a few words at least)."}</p>}
        </div>
        {releasing && lot.furnaceRun && !lot.furnaceRun.withinWindow && (
          <label className="flex min-h-touch items-center gap-2">
            <input type="checkbox" className="size-5" checked={reanneal} onChange={(e) => setReanneal(e.target.checked)} />
            Send it back to be annealed again (the run outside the window stays on record)
          </label>
        )}
        {!confirming && (
          <Button type="submit" variant={releasing ? "primary" : "danger"} disabled={reason.trim().length < 3}>
            {releasing ? "Release the hold…" : "Put on hold…"}
          </Button>
        )}
      </form>
      {confirming && (
        <div className="mt-3 space-y-3 rounded-md border-2 border-caution-200 bg-caution-50 p-4" role="group" aria-label="Confirm">
          <p className="font-semibold">
            {releasing
              ? reanneal
                ? `Send lot ${lot.number} back to wait for another furnace load?`
                : `Release lot ${lot.number} with the record as it is? Its jobs go on to the next step.`
              : `Stop lot ${lot.number}? No scan moves its jobs until the planner releases it.`}
          </p>
          <div className="flex flex-wrap gap-3">
            <Button onClick={() => void go()} pending={mutation.isPending} pendingLabel="Saving…">
              {releasing ? "Yes, release" : "Yes, hold"}
            </Button>
            <Button variant="secondary" onClick={() => setConfirming(false)}>
              Cancel
            </Button>
          </div>
        </div>
      )}
      {error && !error.fields.reason && (
        <StatusNote tone="danger" word="Not saved" live="assertive" className="mt-3">
          {error.message}
        </StatusNote>
      )}
      {done && (
        <StatusNote tone="ok" live="polite" className="mt-3">
          {done}
        </StatusNote>
      )}
    </Panel>
  );
}

function Item({ term, children }: { term: string; children: React.ReactNode }) {
  return (
    <div>
      <dt className="text-meta font-semibold uppercase tracking-wide text-flux-600">{term}</dt>
      <dd>{children}</dd>
    </div>
  );
}
