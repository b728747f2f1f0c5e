import { useState, type FormEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import type { LotSummaryJson } from "../../../shared/schemas/jobs";
import { ApiError } from "../../api/client";
import { lotFiltersFrom, lotsQueryOptions } from "../../api/jobs";
import { useRecordShipment } from "../../api/orders";
import { paths } from "../../config/paths";
import { formatDate } from "../../lib/format";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { QueryError } from "../../components/query-error";
import { Loading } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { LateMark } from "./late-mark";

export const packedLotsFilters = () => lotFiltersFrom(new URLSearchParams({ status: "finished", sort: "dueDate", dir: "asc" }));

/** Packed lots, by order: each order's parcel is recorded with its carrier and tracking number. */
export function ReadyToShip() {
  const lots = useQuery(lotsQueryOptions(packedLotsFilters()));
  if (lots.isPending) return <Loading label="Loading packed lots…" />;
  if (lots.isError) return <QueryError error={lots.error} onRetry={() => lots.refetch()} what="the packed lots" />;
  const byOrder = new Map<string, LotSummaryJson[]>();
  for (const l of lots.data.items) byOrder.set(l.orderId, [...(byOrder.get(l.orderId) ?? []), l]);
  if (byOrder.size === 0)
    return (
      <Panel title="Packed, ready to ship">
        <p className="rounded-md bg-nickel-100 p-4 text-flux-700">Nothing is packed and waiting. Lots appear here when every job in them has passed pack.</p>
      </Panel>
    );
  return (
    <div className="space-y-6" data-testid="ready-to-ship">
      {[...byOrder.entries()].map(([orderId, orderLots]) => (
        <OrderParcel key={orderId} orderId={orderId} lots={orderLots} />
      ))}
    </div>
  );
}

function OrderParcel({ orderId, lots }: { orderId: string; lots: LotSummaryJson[] }) {
  const ship = useRecordShipment();
  const [chosen, setChosen] = useState(() => lots.map((l) => l.id));
  const [carrier, setCarrier] = useState("");
  const [tracking, setTracking] = useState("");
  const [confirming, setConfirming] = useState(false);
  const [done, setDone] = useState<string | null>(null);
  const error = ship.error instanceof ApiError ? ship.error : null;
  const first = lots[0];
  const ask = (e: FormEvent) => {
    e.preventDefault();
    setDone(null);
    setConfirming(true);
  };
  const go = async () => {
    try {
      const order = await ship.mutateAsync({ id: orderId, carrier: carrier.trim(), trackingNumber: tracking.trim(), lotIds: chosen });
      setDone(`Shipped with ${carrier.trim()} (${tracking.trim()}). ${order.status === "shipped" ? "The order is complete; the customer has been sent the shipping mail." : "More lots of this order are still on the floor."}`);
    } catch {
      // shown below
    } finally {
      setConfirming(false);
    }
  };
  return (
    <Panel title={`Order ${first.orderNumber} · ${first.organizationName}`}>
      {done ? (
        <StatusNote tone="ok" word="Shipped" live="polite">
          <span data-testid="shipped-note">{done}</span>
        </StatusNote>
      ) : (
        <form onSubmit={ask} className="space-y-4" data-testid="ship-form">
          <fieldset className="space-y-2">
            <legend className="font-semibold">Lots in the parcel</legend>
            <ul className="grid gap-2 sm:grid-cols-2">
              {lots.map((l) => (
                <li key={l.id}>
                  <label className="flex min-h-touch items-center gap-3 rounded-md border border-nickel-200 p-3">
                    <input type="checkbox" className="size-5" checked={chosen.includes(l.id)} onChange={(e) => setChosen((c) => (e.target.checked ? [...c, l.id] : c.filter((id) => id !== l.id)))} />
                    <span>
                      <Link className="font-mono font-semibold underline" to={paths.floorLot.href(l.id)}>
                        {l.number}
                      </Link>{" "}
                      · {l.pieces} pcs · due {formatDate(l.dueDate)}
                      <LateMark late={l.late} />
                    </span>
                  </label>
                </li>
              ))}
            </ul>
            {error?.fields.lotIds && <p className="font-semibold text-danger-700">{error.fields.lotIds}</p>}
          </fieldset>
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField label="Carrier" value={carrier} onChange={(e) => setCarrier(e.target.value)} error={error?.fields.carrier} />
            <TextField label="Tracking number" value={tracking} onChange={(e) => setTracking(e.target.value)} error={error?.fields.trackingNumber} className="font-mono" />
          </div>
          {!confirming && (
            <Button type="submit" disabled={chosen.length === 0}>
              Record the shipment…
            </Button>
          )}
        </form>
      )}
      {confirming && (
        <div className="mt-4 space-y-3 rounded-md border-2 border-caution-200 bg-caution-50 p-4" role="group" aria-label="Confirm the shipment">
          <p className="font-semibold">
            Ship {chosen.length} {chosen.length === 1 ? "lot" : "lots"} of {first.orderNumber} with {carrier.trim() || "—"}, tracking {tracking.trim() || "—"}? The customer is told by mail.
          </p>
          <div className="flex flex-wrap gap-3">
            <Button onClick={() => void go()} pending={ship.isPending} pendingLabel="Recording…">
              Yes, it has left
            </Button>
            <Button variant="secondary" onClick={() => setConfirming(false)}>
              Cancel
            </Button>
          </div>
        </div>
      )}
      {error && !Object.keys(error.fields).length && (
        <StatusNote tone="danger" word="Not recorded" live="assertive" className="mt-3">
          {error.message}
        </StatusNote>
      )}
    </Panel>
  );
}
