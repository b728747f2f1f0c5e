import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import { Link, type LoaderFunctionArgs } from "react-router-dom";
import { certificatesQueryOptions, type CertificateSummaryJson } from "../api/quality";
import { QueryError } from "../components/query-error";
import { PageHeader, Panel } from "../components/ui/panel";
import { ResponsiveTable } from "../components/ui/responsive-table";
import { Loading } from "../components/ui/spinner";
import { requireUser, warm } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireUser(queryClient, request);
  await warm(queryClient.ensureQueryData(certificatesQueryOptions));
  return null;
};

/** Each lot's certificate of conformance, by order: download it or open its public check. */
export function Component() {
  const list = useQuery(certificatesQueryOptions);
  return (
    <>
      <PageHeader title="Certificates" lead="The certificate of conformance of each lot shipped to you. A corrected certificate is a new revision; the older one stays, marked superseded." />
      <Panel>
        {list.isPending && <Loading label="Loading the certificates…" />}
        {list.isError && <QueryError error={list.error} onRetry={() => void list.refetch()} what="the certificates" />}
        {list.data && list.data.length === 0 && <p className="text-flux-700">No certificates yet: each lot gets one when it passes its inspection.</p>}
        {list.data && list.data.length > 0 && (
          <ResponsiveTable<CertificateSummaryJson>
            caption="Certificates"
            testId="certificates-table"
            rowTestId="certificate-row"
            rows={list.data}
            rowKey={(c) => c.id}
            cardsBelow={700}
            columns={[
              { key: "number", header: "Certificate", primary: true, cell: (c) => `${c.number} rev. ${c.revision}` },
              { key: "order", header: "Order", cell: (c) => c.order.number },
              { key: "lot", header: "Lot", cell: (c) => c.lot.number },
              { key: "issued", header: "Issued", cell: (c) => c.issuedAt.slice(0, 10) },
              { key: "state", header: "State", cell: (c) => (c.current ? "current" : `superseded by rev. ${c.supersededBy?.revision}`) },
              {
                key: "links",
                header: <span className="sr-only">Links</span>,
                cell: (c) => (
                  <span className="flex flex-wrap gap-3">
                    <a className="underline" href={c.pdfUrl}>Download<span className="sr-only"> {c.number} revision {c.revision}</span></a>
                    <Link className="underline" to={c.verifyUrl}>Check<span className="sr-only"> {c.number} revision {c.revision}</span></Link>
                  </span>
                ),
              },
            ]}
          />
        )}
      </Panel>
    </>
  );
}
