import { useState } from "react";
import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { adminMaterialsQueryOptions } from "../api/materials";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { Button } from "../components/ui/button";
import { PageHeader, Panel } from "../components/ui/panel";
import { Loading } from "../components/ui/spinner";
import { StatusNote } from "../components/ui/status-note";
import { MaterialForm } from "../features/materials-admin/material-form";
import { MaterialHistory } from "../features/materials-admin/material-history";
import { requireRole, warm } from "../lib/guards";
import { ScrollX } from "../components/ui/scroll-x";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["admin"]);
  await warm(queryClient.ensureQueryData(adminMaterialsQueryOptions));
  return null;
};

const sci = (x: number) => (x >= 1e-3 && x < 1e5 ? String(+x.toPrecision(4)) : x.toExponential(2));

export function Component() {
  const list = useQuery(adminMaterialsQueryOptions);
  // null: nothing open; "new": the add form; an id: that material's form and history
  const [open, setOpen] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const selected = open && open !== "new" ? (list.data?.items.find((m) => m.id === open) ?? null) : null;

  return (
    <>
      <PageHeader title="Materials" lead="The library the design check and the flat-blank calculator compute with. Every value names its source; every change is recorded." />
      {list.isPending && <Loading label="Loading the materials…" />}
      {list.isError && <QueryError error={list.error} onRetry={() => void list.refetch()} what="the materials" />}
      {list.data && (
        <div className="space-y-6">
          {saved && (
            <StatusNote tone="ok" word="Saved">
              {saved} is saved; predictions use it from now on.
            </StatusNote>
          )}
          <Panel title="Library" actions={<Button variant="secondary" onClick={() => { setSaved(null); setOpen("new"); }}>Add a material</Button>}>
            <ScrollX label="the materials table">
              <table className="w-full text-left text-body">
                <thead className="border-b border-nickel-300 text-meta text-flux-600">
                  <tr>
                    <th className="py-1 pr-3 font-semibold">Id</th>
                    <th className="py-1 pr-3 font-semibold">Name</th>
                    <th className="py-1 pr-3 font-semibold">μr initial / max</th>
                    <th className="py-1 pr-3 font-semibold">Saturation</th>
                    <th className="py-1 pr-3 font-semibold">Resistivity</th>
                    <th className="py-1 pr-3 font-semibold">Density</th>
                    <th className="py-1 pr-3 font-semibold">In use</th>
                    <th className="py-1 font-semibold"><span className="sr-only">Actions</span></th>
                  </tr>
                </thead>
                <tbody>
                  {list.data.items.map((m) => (
                    <tr key={m.id} className={`border-b border-nickel-100 ${open === m.id ? "bg-anneal-50" : ""}`}>
                      <td className="whitespace-nowrap py-1.5 pr-3 font-mono">{m.id}</td>
                      <td className="py-1.5 pr-3">{m.name}</td>
                      <td className="whitespace-nowrap py-1.5 pr-3 font-mono">{m.relativePermeability.initial.toLocaleString("en-GB")} / {m.relativePermeability.maximum.toLocaleString("en-GB")}</td>
                      <td className="whitespace-nowrap py-1.5 pr-3 font-mono">{m.saturation_T == null ? "—" : `${m.saturation_T} T`}</td>
                      <td className="whitespace-nowrap py-1.5 pr-3 font-mono">{sci(m.resistivity_ohm_m)} Ω·m</td>
                      <td className="whitespace-nowrap py-1.5 pr-3 font-mono">{m.density_kg_m3} kg/m³</td>
                      <td className="py-1.5 pr-3">{m.active ? "yes" : "no"}</td>
                      <td className="py-1.5">
                        <Button variant="quiet" className="min-h-9 px-2" onClick={() => { setSaved(null); setOpen(m.id); }} aria-label={`Edit ${m.id}`}>
                          Edit
                        </Button>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </ScrollX>
          </Panel>
          {open && (
            <div className="grid items-start gap-6 xl:grid-cols-[1fr_22rem]">
              <PanelBoundary name="the material form">
                <MaterialForm
                  key={open}
                  material={selected}
                  onSaved={(id) => { setSaved(id); setOpen(id); }}
                  onCancel={() => setOpen(null)}
                />
              </PanelBoundary>
              {selected && (
                <PanelBoundary name="the changes">
                  <MaterialHistory id={selected.id} />
                </PanelBoundary>
              )}
            </div>
          )}
        </div>
      )}
    </>
  );
}
