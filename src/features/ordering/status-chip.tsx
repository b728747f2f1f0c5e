import { orderStatusLabels, type OrderStatus } from "../../../shared/schemas/order";
import { quoteStatusLabels, type QuoteStatus } from "../../../shared/schemas/quote";

const look = {
  ok: "bg-ok-50 text-ok-700 border-ok-200",
  caution: "bg-caution-50 text-caution-900 border-caution-200",
  info: "bg-flux-50 text-flux-800 border-flux-200",
  quiet: "bg-nickel-100 text-flux-800 border-nickel-300",
} as const;

const orderLook: Record<OrderStatus, keyof typeof look> = { awaiting_payment: "caution", paid: "ok", released: "info", shipped: "ok", cancelled: "quiet", refunded: "quiet" };
const quoteLook: Record<QuoteStatus, keyof typeof look> = { open: "ok", expired: "caution", ordered: "info" };

/** A record's state in words on a tinted tag: the words carry it, the tint only helps. */
export function OrderStatusChip({ status }: { status: OrderStatus }) {
  return <span className={`inline-block whitespace-nowrap rounded border px-1.5 py-0.5 font-mono text-[0.8125rem] ${look[orderLook[status]]}`} data-testid="order-status">{orderStatusLabels[status]}</span>;
}

export function QuoteStatusChip({ status }: { status: QuoteStatus }) {
  return <span className={`inline-block whitespace-nowrap rounded border px-1.5 py-0.5 font-mono text-[0.8125rem] ${look[quoteLook[status]]}`} data-testid="quote-status">{quoteStatusLabels[status]}</span>;
}
