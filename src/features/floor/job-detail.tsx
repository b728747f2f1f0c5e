import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { jobStatusLabels, type JobStepJson } from "../../../shared/schemas/jobs";
import { jobQueryOptions, travelerPdfUrl } from "../../api/jobs";
import { paths } from "../../config/paths";
import { formatDate, formatDateTime } from "../../lib/format";
import { Button } from "../../components/ui/button";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";
import { Loading } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { LateMark } from "./late-mark";
import { PrintLinks } from "./print-links";
import { RoutingEditor } from "./routing-editor";

const blankText = (b: { kind: string; diameter_mm?: number; length_mm?: number; width_mm?: number }) =>
  b.kind === "disc" ? `disc Ø ${b.diameter_mm?.toFixed(1)} mm` : `${b.kind} ${b.length_mm?.toFixed(1)} × ${b.width_mm?.toFixed(1)} mm`;

const who = (s: JobStepJson["started"]) => (s ? `${formatDateTime(s.at)}${s.by ? `, ${s.by.name}` : ""} at ${s.station}` : "—");

export function JobDetail({ id }: { id: string }) {
  const job = useQuery(jobQueryOptions(id));
  const [editing, setEditing] = useState(false);
  if (job.isPending) return <Loading label="Loading the job…" />;
  if (job.isError) return <QueryError error={job.error} onRetry={() => job.refetch()} what="the job" />;
  const j = job.data;
  return (
    <div className="space-y-6">
      <Panel>
        <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-2 lg:grid-cols-3">
          <Item term="State">
            {jobStatusLabels[j.status]}
            <LateMark late={j.late} />
          </Item>
          <Item term="Part">{j.part.description}</Item>
          <Item term="Pieces">{j.part.quantity}</Item>
          <Item term="Material">
            {j.part.materialName}, {j.part.thickness_mm} mm{j.heat && <> · heat <span className="font-mono">{j.heat.heatNumber}</span></>}
          </Item>
          <Item term="Blank">{blankText(j.part.blank)}</Item>
          <Item term="Due">{formatDate(j.dueDate)}</Item>
          <Item term="Lot">
            <Link className="font-mono underline" to={paths.floorLot.href(j.lot.id)}>
              {j.lot.number}
            </Link>
            {j.lot.onHold && <span className="ml-2 font-semibold text-danger-700">on hold</span>}
          </Item>
          <Item term="Order">
            <span className="font-mono">{j.order.number}</span> · {j.order.organization.name}
          </Item>
          {j.furnaceRun && <Item term="Furnace run"><span className="font-mono">{j.furnaceRun.number}</span></Item>}
          {j.assemblyJob && (
            <Item term="Welded onto">
              <Link className="font-mono underline" to={paths.floorJob.href(j.assemblyJob.id)}>{j.assemblyJob.code}</Link>
            </Item>
          )}
          {j.components.length > 0 && (
            <Item term="Welded on">
              {j.components.map((c, i) => (
                <span key={c.id}>
                  {i > 0 && ", "}
                  <Link className="font-mono underline" to={paths.floorJob.href(c.id)}>{c.code}</Link>
                </span>
              ))}
            </Item>
          )}
        </dl>
        {j.abilities.print && (
          <div className="mt-5 flex flex-wrap gap-2">
            <PrintLinks what="Traveler" url={(paper) => travelerPdfUrl(j.id, paper)} testId="traveler-links" />
          </div>
        )}
      </Panel>

      <Panel
        title="Routing"
        actions={j.abilities.editRouting && !editing ? <Button variant="secondary" onClick={() => setEditing(true)}>Change the routing</Button> : undefined}
      >
        {editing ? (
          <RoutingEditor job={j} onDone={() => setEditing(false)} />
        ) : (
          <>
            {!j.abilities.editRouting && j.status === "in_progress" && <p className="mb-3 text-flux-700">Work has started on this job, so its routing is fixed.</p>}
            <ol className="space-y-2" data-testid="job-steps">
              {j.steps.map((s, i) => (
                <li key={s.key} className={`rounded-md border p-3 ${j.next?.step === s.key ? "border-anneal-600 bg-anneal-50" : "border-nickel-200"}`}>
                  <div className="flex flex-wrap justify-between gap-2">
                    <span className="font-semibold">
                      {i + 1}. {s.label}
                      {s.drawStages ? ` · ${s.drawStages} draws, ${s.processAnneals ?? 0} process anneals` : ""}
                    </span>
                    <span className="font-mono text-meta text-flux-600">{s.barcode}</span>
                  </div>
                  {s.note && <p className="text-flux-700">{s.note}</p>}
                  <p className="text-meta text-flux-700">
                    Started {who(s.started)} · completed {who(s.completed)}
                  </p>
                </li>
              ))}
            </ol>
          </>
        )}
        {j.steps.some((s) => s.key === "form") && (
          <StatusNote tone="caution" className="mt-4">
            Press and shear work: guards and interlocks in service, cut-resistant gloves for sheared edges; follow the site&rsquo;s procedures and local machine-safety rules.
          </StatusNote>
        )}
      </Panel>
    </div>
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
