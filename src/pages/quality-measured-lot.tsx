import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { Link, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { measuredLotQueryOptions, type MeasuredLot } from "../api/calibration";
import { QueryError } from "../components/query-error";
import { PageHeader, Panel } from "../components/ui/panel";
import { ResponsiveTable } from "../components/ui/responsive-table";
import { Loading } from "../components/ui/spinner";
import { paths } from "../config/paths";
import { db, when } from "../features/calibration/words";
import { requireRole, warm } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request, params }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["qa", "admin"]);
  await warm(queryClient.ensureQueryData(measuredLotQueryOptions(params.lotId ?? "")));
  return null;
};

type Part = MeasuredLot["parts"][number];

export function Component() {
  const { lotId = "" } = useParams();
  const lot = useQuery(measuredLotQueryOptions(lotId));
  const d = lot.data;
  return (
    <>
      <PageHeader eyebrow="Quality · measured lot" title={d ? `Lot ${d.number}` : "Measured lot"} lead={d ? `${d.disposition === "accepted" ? "Accepted" : "Rejected"} ${when(d.decidedAt)}; required ${db(d.requiredAttenuation_db)}.` : undefined} />
      <p className="mb-4 text-meta"><Link className="underline" to={paths.calibration.href()}>Calibrated predictions</Link> · <Link className="underline" to={paths.controlCharts.href()}>Control charts</Link></p>
      {lot.isPending && <Loading label="Loading the lot…" />}
      {lot.isError && <QueryError error={lot.error} onRetry={() => void lot.refetch()} what="the lot" />}
      {d && (
        <Panel title="Parts measured">
          <ResponsiveTable<Part>
            caption={`Parts measured in lot ${d.number}`}
            testId="lot-parts"
            rows={d.parts}
            rowKey={(p) => p.serial}
            columns={[
              { key: "serial", header: "Serial", primary: true, className: "font-mono", cell: (p) => p.serial },
              { key: "f", header: "Frequency", align: "end", className: "font-mono", cell: (p) => `${p.frequency_hz} Hz` },
              { key: "b", header: "Applied field", align: "end", className: "font-mono", cell: (p) => `${p.appliedField_uT} µT` },
              { key: "o", header: "Direction", cell: (p) => p.orientation ?? "transverse" },
              { key: "a", header: "Attenuation", align: "end", className: "font-mono", cell: (p) => db(p.measured_db) },
              { key: "m", header: "Margin", align: "end", className: "font-mono", cell: (p) => db(p.measured_db - d.requiredAttenuation_db, true) },
            ]}
          />
        </Panel>
      )}
    </>
  );
}
