import { useEffect, useId, useRef, useState, type FormEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router-dom";
import { heatUnits, type HeatJson } from "../../../shared/schemas/heats";
import { ApiError } from "../../api/client";
import { heatFiltersFrom, heatsQueryOptions, millCertificateUrl, useAttachMillCertificate, useReceiveHeat } from "../../api/heats";
import { materialsQueryOptions } from "../../api/materials";
import { formatDate } from "../../lib/format";
import { Button } from "../../components/ui/button";
import { control, TextField } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Loading } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { plainScale, quantityScale, UnitInput } from "../../components/ui/unit-input";
import { Pager } from "../../components/ui/list-controls";

const ACCEPT = "application/pdf,image/png,image/jpeg,image/tiff,image/webp,.pdf,.png,.jpg,.jpeg,.tif,.tiff,.webp";

/** A delivery of sheet: its heat number, alloy, gauge, supplier, quantity, and the mill certificate. */
export function ReceiveHeat() {
  const materials = useQuery(materialsQueryOptions);
  const receive = useReceiveHeat();
  const attach = useAttachMillCertificate();
  const [heatNumber, setHeatNumber] = useState("");
  const [materialId, setMaterialId] = useState("");
  const [thickness, setThickness] = useState<number | null>(null);
  const [supplier, setSupplier] = useState("");
  const [quantity, setQuantity] = useState<number | null>(null);
  const [unit, setUnit] = useState<(typeof heatUnits)[number]>("sheets");
  const [receivedOn, setReceivedOn] = useState(() => new Date().toISOString().slice(0, 10));
  const [notes, setNotes] = useState("");
  const [done, setDone] = useState<string | null>(null);
  const file = useRef<HTMLInputElement>(null);
  const ids = { alloy: useId(), unit: useId(), file: useId(), notes: useId() };
  const error = receive.error instanceof ApiError ? receive.error : null;
  const fileError = attach.error instanceof ApiError ? attach.error : null;
  const f = (k: string) => error?.fields[k];

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setDone(null);
    attach.reset();
    try {
      const heat = await receive.mutateAsync({
        heatNumber: heatNumber.trim(),
        materialId,
        thickness_mm: thickness as number,
        supplier: supplier.trim(),
        quantity: quantity as number,
        unit,
        receivedOn,
        notes: notes.trim() || undefined,
      });
      const chosen = file.current?.files?.[0];
      let certificate = "";
      if (chosen) {
        try {
          await attach.mutateAsync({ id: heat.id, file: chosen });
          certificate = " with its mill certificate";
        } catch {
          certificate = "; the mill certificate was not accepted (see below), attach it from the list";
        }
      }
      setDone(`Heat ${heat.heatNumber} received${certificate}.`);
      setHeatNumber("");
      setQuantity(null);
      setNotes("");
      if (file.current) file.current.value = "";
    } catch {
      // shown beside the fields
    }
  };

  return (
    <Panel title="Receive a delivery">
      <form onSubmit={submit} className="space-y-4" noValidate data-testid="heat-form">
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Heat number" value={heatNumber} onChange={(e) => setHeatNumber(e.target.value)} error={f("heatNumber")} className="font-mono" />
          <div className="space-y-1.5">
            <label htmlFor={ids.alloy} className="block font-semibold text-flux-900">
              Alloy
            </label>
            <select id={ids.alloy} value={materialId} onChange={(e) => setMaterialId(e.target.value)} aria-invalid={Boolean(f("materialId"))} className={`${control} border-nickel-400`}>
              <option value="">Choose the alloy</option>
              {(materials.data ?? []).map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name}
                </option>
              ))}
            </select>
            {f("materialId") && <p className="text-meta font-semibold text-danger-700">{f("materialId")}</p>}
          </div>
          <UnitInput label="Gauge" scale={quantityScale("length", "mm")} value={thickness} onValueChange={setThickness} error={f("thickness_mm")} />
          <TextField label="Supplier" value={supplier} onChange={(e) => setSupplier(e.target.value)} error={f("supplier")} />
          <div className="grid grid-cols-[1fr_auto] items-start gap-2">
            <UnitInput label="Quantity received" scale={plainScale} value={quantity} onValueChange={setQuantity} error={f("quantity")} />
            <div className="space-y-1.5">
              <label htmlFor={ids.unit} className="block font-semibold text-flux-900">
                Counted in
              </label>
              <select id={ids.unit} value={unit} onChange={(e) => setUnit(e.target.value as typeof unit)} className={`${control} border-nickel-400`}>
                <option value="sheets">sheets</option>
                <option value="kg">kg</option>
              </select>
            </div>
          </div>
          <TextField label="Received on" type="date" value={receivedOn} onChange={(e) => setReceivedOn(e.target.value)} error={f("receivedOn")} />
        </div>
        <div className="space-y-1.5">
          <label htmlFor={ids.file} className="block font-semibold text-flux-900">
            Mill certificate (PDF or image, up to 20 MB)
          </label>
          <input id={ids.file} ref={file} type="file" accept={ACCEPT} className="block min-h-touch" />
        </div>
        <div className="space-y-1.5">
          <label htmlFor={ids.notes} className="block font-semibold text-flux-900">
            Notes
          </label>
          <textarea id={ids.notes} rows={2} value={notes} onChange={(e) => setNotes(e.target.value)} className={`${control} border-nickel-400`} />
        </div>
        <Button type="submit" pending={receive.isPending || attach.isPending} pendingLabel="Saving…">
          Record the delivery
        </Button>
      </form>
      {error && !Object.keys(error.fields).length && (
        <StatusNote tone="danger" word="Not recorded" live="assertive" className="mt-3">
          {error.message}
        </StatusNote>
      )}
      {fileError && (
        <StatusNote tone="danger" word="Certificate refused" live="assertive" className="mt-3">
          {fileError.fields.file ?? fileError.message}
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

export function HeatList() {
  const [search, setSearch] = useSearchParams();
  const filters = heatFiltersFrom(search);
  const heats = useQuery(heatsQueryOptions(filters));
  const [draft, setDraft] = useState(filters.q);
  const qId = useId();
  useEffect(() => setDraft(filters.q), [filters.q]);
  const go = (next: { q?: string; page?: number }) => {
    const s = new URLSearchParams();
    const q = next.q ?? filters.q;
    if (q) s.set("q", q);
    if ((next.page ?? 1) > 1) s.set("page", String(next.page));
    setSearch(s);
  };
  return (
    <Panel title="Heats received">
      <form
        role="search"
        aria-label="Search heats"
        onSubmit={(e) => {
          e.preventDefault();
          go({ q: draft.trim() });
        }}
        className="mb-4 flex flex-wrap items-end gap-3"
      >
        <div className="min-w-0 flex-1 basis-56 space-y-1.5">
          <label htmlFor={qId} className="block font-semibold">
            Heat number or supplier
          </label>
          <input id={qId} type="search" value={draft} onChange={(e) => setDraft(e.target.value)} className={`${control} border-nickel-400`} />
        </div>
        <Button type="submit" variant="secondary">
          Search
        </Button>
      </form>
      {heats.isPending ? (
        <Loading label="Loading heats…" />
      ) : heats.isError ? (
        <QueryError error={heats.error} onRetry={() => heats.refetch()} what="the heats" />
      ) : heats.data.items.length === 0 ? (
        <p className="rounded-md bg-nickel-100 p-4 text-flux-700">{filters.q ? `No heat matches “${filters.q}”.` : "No deliveries recorded yet."}</p>
      ) : (
        <>
          <ResponsiveTable<HeatJson>
            caption="Heats, newest delivery first"
            rows={heats.data.items}
            rowKey={(h) => h.id}
            testId="heats-table"
            rowTestId="heat-row"
            cardsBelow={700}
            columns={[
              { key: "heat", header: "Heat", primary: true, className: "font-mono font-semibold", cell: (h) => h.heatNumber },
              { key: "alloy", header: "Alloy and gauge", cell: (h) => `${h.materialName}, ${h.thickness_mm} mm` },
              { key: "supplier", header: "Supplier", cell: (h) => h.supplier },
              { key: "qty", header: "Received", cell: (h) => `${h.quantity} ${h.unit} on ${formatDate(h.receivedOn)}` },
              { key: "jobs", header: "Jobs", align: "end", className: "tabular font-mono", cell: (h) => h.jobCount },
              { key: "cert", header: "Mill certificate", cell: (h) => <CertificateCell heat={h} /> },
            ]}
          />
          <Pager label="Heat list pages" page={filters.page} pageSize={filters.pageSize} total={heats.data.total} noun={["heat", "heats"]} onPage={(page) => go({ page })} />
        </>
      )}
    </Panel>
  );
}

function CertificateCell({ heat }: { heat: HeatJson }) {
  const attach = useAttachMillCertificate();
  const error = attach.error instanceof ApiError ? attach.error : null;
  if (heat.millCertificate)
    return (
      <a className="underline" href={millCertificateUrl(heat.id)} target="_blank" rel="noopener">
        {heat.millCertificate.filename}
      </a>
    );
  if (!heat.abilities.attach) return <span className="text-caution-700">missing</span>;
  return (
    <span className="space-y-1">
      <label className="block">
        <span className="sr-only">Mill certificate for heat {heat.heatNumber} (PDF or image)</span>
        <input type="file" accept={ACCEPT} className="max-w-52 text-meta" onChange={(e) => e.target.files?.[0] && attach.mutate({ id: heat.id, file: e.target.files[0] })} />
      </label>
      {attach.isPending && <span className="text-meta">Uploading…</span>}
      {error && <span className="block text-meta font-semibold text-danger-700">{error.fields.file ?? error.message}</span>}
    </span>
  );
}
