import { useState } from "react";
import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { adminMaterialsQueryOptions, type MaterialRecord } from "../api/materials";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { Button } from "../components/ui/button";
import { PageHeader, Panel } from "../components/ui/panel";
import { ResponsiveTable } from "../components/ui/responsive-table";
import { Loading } from "../components/ui/spinner";
import { grouped } from "../features/materials-admin/change-words";
import { MaterialForm } from "../features/materials-admin/material-form";
import { MaterialHistory } from "../features/materials-admin/material-history";
import { MuCurvePlot } from "../features/materials-admin/mu-curve-plot";
import { requireRole, warm } from "../lib/guards";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireRole(queryClient, request, ["admin"]);
  await warm(queryClient.ensureQueryData(adminMaterialsQueryOptions));
  return null;
};

const resistivity = (ohm_m: number) => `${grouped(ohm_m * 1e6, 3)} µΩ·m`;

export function Component() {
  const list = useQuery(adminMaterialsQueryOptions);
  // null: nothing open; "new": the add form; an id: that material's form and history
  const [open, setOpen] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  // a new form for each Edit or Add; a save keeps the form (and the person's place in it)
  const [formKey, setFormKey] = useState(0);
  const openForm = (id: string) => {
    setSaved(null);
    setOpen(id);
    setFormKey((k) => k + 1);
  };
  const selected = open && open !== "new" ? (list.data?.items.find((m) => m.id === open) ?? null) : null;

  return (
    <>
      <PageHeader title="Materials" lead="The library the design check and the flat-blank calculator compute with. Every value names its source; every change is recorded." />
      {list.isPending && <Loading label="Loading the materials…" />}
      {list.isError && <QueryError error={list.error} onRetry={() => void list.refetch()} what="the materials" />}
      {list.data && (
        <div className="space-y-6">
          <Panel title="Library" actions={<Button variant="secondary" onClick={() => openForm("new")}>Add a material</Button>}>
            <ResponsiveTable<MaterialRecord>
              caption="Materials in the library"
              testId="materials-table"
              rowTestId="material-row"
              rows={list.data.items}
              rowKey={(m) => m.id}
              cardsBelow={860}
              rowClassName={(m) => (open === m.id ? "bg-anneal-50" : "")}
              columns={[
                { key: "id", header: "Id", primary: true, className: "font-mono whitespace-nowrap", cell: (m) => m.id },
                { key: "name", header: "Name", cell: (m) => m.name },
                { key: "mu", header: "μr initial / max", className: "font-mono whitespace-nowrap", cell: (m) => `${grouped(m.relativePermeability.initial)} / ${grouped(m.relativePermeability.maximum)}` },
                { key: "curve", header: "μ(B)", cell: (m) => <MuCurvePlot curve={m.muCurve} small name={m.id} /> },
                { key: "sat", header: "Saturation", className: "font-mono whitespace-nowrap", cell: (m) => (m.saturation_T == null ? "—" : `${m.saturation_T} T`) },
                { key: "rho", header: "Resistivity", className: "font-mono whitespace-nowrap", cell: (m) => resistivity(m.resistivity_ohm_m) },
                { key: "density", header: "Density", className: "font-mono whitespace-nowrap", cell: (m) => `${grouped(m.density_kg_m3)} kg/m³` },
                { key: "use", header: "In use", cell: (m) => (m.active ? "yes" : "no") },
                {
                  key: "edit",
                  header: <span className="sr-only">Actions</span>,
                  cell: (m) => (
                    <Button variant="quiet" className="min-h-9 px-2" onClick={() => openForm(m.id)} aria-label={`Edit ${m.id}`}>
                      Edit
                    </Button>
                  ),
                },
              ]}
            />
          </Panel>
          {open && (
            <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
              <PanelBoundary name="the material form">
                <MaterialForm key={formKey} material={selected} saved={saved} onSaved={(id) => { setSaved(id); setOpen(id); }} onCancel={() => setOpen(null)} />
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
