import { useState } from "react";
import { Link, useSearchParams } from "react-router-dom";
import { useQuery } from "@tanstack/react-query";
import { MAX_DRAWINGS_PER_ORDER, type PaymentJson } from "../../../shared/schemas/order";
import { ApiError } from "../../api/client";
import { invoicePdfUrl, orderQueryOptions, useCancelOrder, useRemoveDrawing, useStartCheckout, useUploadDrawings, type OrderFileJson, type OrderJson } from "../../api/orders";
import { PanelBoundary } from "../../components/error-boundary";
import { QueryError } from "../../components/query-error";
import { Button, buttonClass } from "../../components/ui/button";
import { Panel } from "../../components/ui/panel";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Loading, Spinner } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { paths } from "../../config/paths";
import { formatDate, formatDateTime } from "../../lib/format";
import { formatMoney } from "../../lib/money";
import { drawingProblem, fileSize } from "./drawing-check";
import { DrawingPicker } from "./drawing-picker";
import { RefundForm } from "./refund-form";
import { OrderStatusChip } from "./status-chip";

const problemText = (e: unknown, fallback: string) => (e instanceof ApiError ? (Object.values(e.fields)[0] ?? e.message) : fallback);

/** One order: its details and state, paying it, its drawings, payments and refunds, and its timeline from the event trail. */
export function OrderDetail({ id }: { id: string }) {
  const [search] = useSearchParams();
  const returned = search.get("checkout");
  // back from the payment page: the order is asked again until the signed event has marked it paid
  const order = useQuery(orderQueryOptions(id, { awaitingPayment: returned === "returned" }));
  if (order.isPending) return <Loading label="Loading the order…" />;
  if (order.isError) return <QueryError error={order.error} onRetry={() => void order.refetch()} what="the order" />;
  const o = order.data;
  return (
    <div className="space-y-6">
      <CheckoutReturn order={o} returned={returned} />
      <div className="grid grid-cols-1 items-start gap-6 lg:grid-cols-2">
        <PanelBoundary name="the order's details">
          <Summary order={o} />
        </PanelBoundary>
        <PanelBoundary name="payments">
          <Payments order={o} />
        </PanelBoundary>
      </div>
      <div className="grid grid-cols-1 items-start gap-6 lg:grid-cols-2">
        <PanelBoundary name="the drawings">
          <Drawings order={o} />
        </PanelBoundary>
        <PanelBoundary name="the timeline">
          <Timeline order={o} />
        </PanelBoundary>
      </div>
    </div>
  );
}

function CheckoutReturn({ order, returned }: { order: OrderJson; returned: string | null }) {
  if (returned === "returned") {
    return order.status === "awaiting_payment" ? (
      <StatusNote tone="info" word="Waiting for the payment service" live="polite">
        <span className="flex items-center gap-2">
          <Spinner /> The payment service has not confirmed the payment yet. This page updates by itself; nothing more to do.
        </span>
      </StatusNote>
    ) : (
      <StatusNote tone="ok" word="Payment received" live="polite">
        Thank you: the payment is confirmed{order.invoice ? ` and invoice ${order.invoice.number} is issued` : ""}. A receipt is on its way by mail.
      </StatusNote>
    );
  }
  if (returned === "cancelled" && order.status === "awaiting_payment") {
    return (
      <StatusNote tone="info" word="Not paid">
        You left the payment page; nothing was charged. The order waits for payment: pay when you are ready.
      </StatusNote>
    );
  }
  return null;
}

function Summary({ order: o }: { order: OrderJson }) {
  const pay = useStartCheckout();
  const cancel = useCancelOrder();
  const [asking, setAsking] = useState(false);
  const money = (c: number) => formatMoney(c, o.currency);
  const startPayment = () =>
    pay.mutate(o.id, {
      onSuccess: (session) => {
        window.location.assign(session.checkoutUrl);
      },
    });
  return (
    <Panel title="Order">
      <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-4 gap-y-1.5">
        <dt className="font-semibold text-flux-700">Status</dt>
        <dd>
          <OrderStatusChip status={o.status} />
        </dd>
        <dt className="font-semibold text-flux-700">Quote</dt>
        <dd>
          <Link className="font-mono underline underline-offset-4" to={paths.quote.href(o.quote.id)}>
            {o.quote.number}
          </Link>
        </dd>
        <dt className="font-semibold text-flux-700">For</dt>
        <dd>{o.organization.name}{o.createdBy ? ` · ordered by ${o.createdBy.name}` : ""}</dd>
        <dt className="font-semibold text-flux-700">Design</dt>
        <dd>{o.summary}</dd>
        <dt className="font-semibold text-flux-700">Quantity</dt>
        <dd className="font-mono">{o.quantity}</dd>
        <dt className="font-semibold text-flux-700">Total</dt>
        <dd className="font-mono font-semibold" data-testid="order-total">
          {money(o.total_cents)}
        </dd>
        <dt className="font-semibold text-flux-700">Needs</dt>
        <dd>
          <span className="font-mono">{o.requiredAttenuation_db} dB</span>, each lot sampled at AQL {o.aql}
        </dd>
        <dt className="font-semibold text-flux-700">Purchase order</dt>
        <dd className="break-words">{o.purchaseOrder ?? "—"}</dd>
        <dt className="font-semibold text-flux-700">Deliver to</dt>
        <dd className="whitespace-pre-line break-words">{o.deliveryAddress ?? "—"}</dd>
        <dt className="font-semibold text-flux-700">Requested</dt>
        <dd className="font-mono">{o.requestedDate ? formatDate(o.requestedDate) : "—"}</dd>
        <dt className="font-semibold text-flux-700">Lead time</dt>
        <dd>{o.leadTime_workingDays} working days from payment</dd>
        {o.notes && (
          <>
            <dt className="font-semibold text-flux-700">Notes</dt>
            <dd className="whitespace-pre-line break-words">{o.notes}</dd>
          </>
        )}
        {o.lots.length > 0 && (
          <>
            <dt className="font-semibold text-flux-700">Lots</dt>
            <dd className="font-mono">{o.lots.map((l) => l.number).join(", ")}</dd>
          </>
        )}
      </dl>
      <div className="mt-5 flex flex-wrap gap-2">
        {o.abilities.pay && (
          <Button onClick={startPayment} pending={pay.isPending || pay.isSuccess} pendingLabel="Opening the payment page…">
            Pay {money(o.total_cents - o.paid_cents)}
          </Button>
        )}
        {o.invoice && (
          <a className={buttonClass("secondary")} href={invoicePdfUrl(o.id)} download>
            Invoice {o.invoice.number} (PDF)
          </a>
        )}
        {o.abilities.cancel && !asking && (
          <Button variant="quiet" onClick={() => setAsking(true)}>
            Cancel the order…
          </Button>
        )}
      </div>
      {pay.isError && (
        <StatusNote tone="danger" word="Payment page not opened" live="assertive" className="mt-3">
          {problemText(pay.error, "The payment service could not be reached.")} Nothing was charged and the order is kept: try again in a moment.
        </StatusNote>
      )}
      {o.abilities.pay && <p className="mt-2 text-meta text-flux-600">You pay on the payment service's page; the order shows paid once the service confirms it.</p>}
      {asking && (
        <div className="mt-3 space-y-2 rounded-md border border-caution-200 bg-caution-50 p-3" role="group" aria-label="Confirm cancelling the order">
          <p className="text-caution-900">Cancel order {o.number}? Nothing has been paid, so nothing is charged; the quote stays as it was.</p>
          <div className="flex flex-wrap gap-2">
            <Button variant="danger" pending={cancel.isPending} pendingLabel="Cancelling…" onClick={() => cancel.mutate(o.id, { onSettled: () => setAsking(false) })}>
              Cancel the order
            </Button>
            <Button variant="secondary" onClick={() => setAsking(false)} autoFocus>
              Keep the order
            </Button>
          </div>
        </div>
      )}
      {cancel.isError && (
        <StatusNote tone="danger" word="Not cancelled" live="assertive" className="mt-3">
          {problemText(cancel.error, "Something went wrong. Try again.")}
        </StatusNote>
      )}
    </Panel>
  );
}

function Payments({ order: o }: { order: OrderJson }) {
  const money = (c: number) => formatMoney(c, o.currency);
  return (
    <Panel title="Payments and refunds">
      {o.payments.length === 0 ? (
        <p className="text-flux-600" data-testid="payments-empty">No payment received yet.</p>
      ) : (
        <ResponsiveTable<PaymentJson>
          caption="Payments and refunds"
          testId="payments-table"
          rowTestId="payment-row"
          rows={o.payments}
          rowKey={(p) => p.id}
          cardsBelow={600}
          columns={[
            { key: "what", header: "What", primary: true, cell: (p) => (p.kind === "refund" ? "Refund" : "Payment") },
            { key: "amount", header: "Amount", align: "end", className: "font-mono whitespace-nowrap", cell: (p) => money(p.kind === "refund" ? -p.amount_cents : p.amount_cents) },
            { key: "status", header: "Status", cell: (p) => (p.status === "refunded" ? "refunded" : "received") },
            { key: "when", header: "When", className: "font-mono whitespace-nowrap", cell: (p) => formatDateTime(p.createdAt) },
            { key: "why", header: "Reason", cell: (p) => p.reason ?? "—" },
          ]}
          footer={[
            { key: "paid", label: "Received", value: money(o.paid_cents), testId: "paid-total" },
            ...(o.refunded_cents ? [{ key: "refunded", label: "Refunded", value: money(-o.refunded_cents), testId: "refunded-total" }] : []),
          ]}
        />
      )}
      {o.paymentIssues && o.paymentIssues.length > 0 && (
        <StatusNote tone="caution" word="Needs the planner" className="mt-4">
          <ul className="space-y-1">
            {o.paymentIssues.map((i) => (
              <li key={i.eventId}>
                {formatDateTime(i.at)}: {i.kind === "amount_mismatch" ? "a payment that did not match the order" : "a payment for an order that was not awaiting one"} — expected {formatMoney(i.expected.amount_cents, i.expected.currency)}, received{" "}
                {i.received.amount_cents === null ? "no amount" : formatMoney(i.received.amount_cents, (i.received.currency ?? i.expected.currency).toUpperCase())} (event {i.eventId}).
              </li>
            ))}
          </ul>
        </StatusNote>
      )}
      {o.abilities.refund && (
        <div className="mt-5 border-t border-nickel-200 pt-4">
          <RefundForm order={o} />
        </div>
      )}
    </Panel>
  );
}

function Drawings({ order: o }: { order: OrderJson }) {
  const upload = useUploadDrawings();
  const remove = useRemoveDrawing();
  const [files, setFiles] = useState<File[]>([]);
  const [problem, setProblem] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const attach = () => {
    setProblem(null);
    setDone(null);
    const bad = files.map(drawingProblem).find(Boolean);
    if (bad) return setProblem(bad);
    upload.mutate(
      { id: o.id, files },
      {
        onSuccess: (r) => {
          setFiles([]);
          setDone(`${r.files.length} drawing${r.files.length === 1 ? "" : "s"} attached.`);
        },
        onError: (e) => setProblem(problemText(e, "The drawings could not be sent. Try again.")),
      },
    );
  };
  return (
    <Panel title="Drawings">
      {o.files.length === 0 ? (
        <p className="text-flux-600" data-testid="drawings-empty">No drawings attached.</p>
      ) : (
        <ul className="space-y-2" aria-label="Attached drawings" data-testid="drawings">
          {o.files.map((f: OrderFileJson) => (
            <li key={f.id} className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-nickel-200 px-3 py-2">
              <span className="min-w-0 break-all">
                <a className="font-semibold text-flux-800 underline underline-offset-4" href={f.url} download>
                  {f.filename}
                </a>{" "}
                <span className="text-meta text-flux-600">
                  {fileSize(f.sizeBytes)} · {formatDateTime(f.uploadedAt)}
                  {f.uploadedBy ? ` · ${f.uploadedBy.name}` : ""}
                </span>
                <span className="block font-mono text-[0.8125rem] text-flux-600" title="SHA-256 of the file as received">
                  SHA-256 {f.sha256.slice(0, 16)}…
                </span>
              </span>
              {o.abilities.upload && (
                <Button variant="quiet" className="min-h-9 px-2 text-meta" aria-label={`Remove ${f.filename}`} pending={remove.isPending && remove.variables?.fileId === f.id} onClick={() => remove.mutate({ orderId: o.id, fileId: f.id }, { onError: (e) => setProblem(problemText(e, "The drawing could not be removed.")) })}>
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      {o.abilities.upload && o.files.length < MAX_DRAWINGS_PER_ORDER && (
        <div className="mt-4 space-y-3 border-t border-nickel-200 pt-4">
          <DrawingPicker label="Add drawings" files={files} onChange={setFiles} already={o.files.length} error={problem} />
          {files.length > 0 && (
            <Button onClick={attach} pending={upload.isPending} pendingLabel="Sending…">
              Attach {files.length} drawing{files.length === 1 ? "" : "s"}
            </Button>
          )}
        </div>
      )}
      {!o.abilities.upload && problem && <p role="alert" className="mt-2 font-semibold text-danger-700">{problem}</p>}
      {done && (
        <StatusNote tone="ok" word="Attached" live="polite" className="mt-3">
          {done}
        </StatusNote>
      )}
    </Panel>
  );
}

function Timeline({ order: o }: { order: OrderJson }) {
  return (
    <Panel title="Timeline">
      {o.timeline.length === 0 ? (
        <p className="text-flux-600">Nothing recorded yet.</p>
      ) : (
        <ol className="space-y-3 border-l-2 border-nickel-300 pl-4" aria-label="What happened to the order, oldest first" data-testid="timeline">
          {o.timeline.map((e, i) => (
            <li key={i} className="relative">
              <span aria-hidden="true" className="absolute -left-[1.4rem] top-1.5 size-2.5 rounded-full border-2 border-white bg-anneal-600" />
              <p className="font-semibold text-flux-900">{e.label}</p>
              <p className="text-meta text-flux-600">
                <span className="font-mono">{formatDateTime(e.at)}</span>
                {e.actor ? ` · ${e.actor.name}` : ""}
                {e.detail ? ` · ${e.detail}` : ""}
              </p>
            </li>
          ))}
        </ol>
      )}
    </Panel>
  );
}
