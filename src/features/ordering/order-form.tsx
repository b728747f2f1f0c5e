import { useState } from "react";
import { useNavigate } from "react-router-dom";
import { useQuery } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { orderCreateSchema } from "../../../shared/schemas/order";
import { ApiError } from "../../api/client";
import { usePlaceOrder, useUploadDrawings } from "../../api/orders";
import { quoteQueryOptions } from "../../api/quotes";
import { QueryError } from "../../components/query-error";
import { Button, ButtonLink } from "../../components/ui/button";
import { FieldShell, TextField, control } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { Loading } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { paths } from "../../config/paths";
import { formatDate } from "../../lib/format";
import { formatMoney } from "../../lib/money";
import { useServerErrors } from "../../lib/use-server-errors";
import { drawingProblem } from "./drawing-check";
import { DrawingPicker } from "./drawing-picker";

type Details = { purchaseOrder?: string; deliveryAddress?: string; requestedDate?: string; notes?: string };
const FIELDS = ["purchaseOrder", "deliveryAddress", "requestedDate", "notes"] as const;
/** Empty boxes are left out: every detail is optional. */
const filled = (v: Details) => Object.fromEntries(Object.entries(v).filter(([, x]) => typeof x === "string" && x.trim() !== "")) as Details;
/** The server's own order schema, on what the boxes hold once the empty ones are left out. */
const detailsSchema = z.preprocess((v: Details) => filled(v), orderCreateSchema.omit({ quoteId: true }));

/** Ordering a quote: purchase order, delivery address, requested date, notes and drawings; then payment on the order's page. */
export function OrderForm({ quoteId }: { quoteId: string }) {
  const quote = useQuery(quoteQueryOptions(quoteId));
  const place = usePlaceOrder();
  const upload = useUploadDrawings();
  const navigate = useNavigate();
  const [files, setFiles] = useState<File[]>([]);
  const [fileError, setFileError] = useState<string | null>(null);
  const [placedButUpload, setPlacedButUpload] = useState<{ orderId: string; message: string } | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<Details>({
    resolver: zodResolver(detailsSchema) as never,
    defaultValues: { purchaseOrder: "", deliveryAddress: "", requestedDate: "", notes: "" },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, FIELDS);

  if (quote.isPending) return <Loading label="Loading the quote…" />;
  if (quote.isError) return <QueryError error={quote.error} onRetry={() => void quote.refetch()} what="the quote" />;
  const q = quote.data;
  if (!q.abilities.order) {
    return (
      <StatusNote tone="caution" word="Cannot be ordered">
        <p>
          Quote {q.number} is {q.status === "expired" ? `expired (it held until ${formatDate(q.expiresAt)})` : q.status === "ordered" ? "already ordered" : "not yours to order"}.
        </p>
        <ButtonLink className="mt-2" to={paths.quote.href(q.id)}>
          Back to the quote
        </ButtonLink>
      </StatusNote>
    );
  }

  const onSubmit = handleSubmit(async (values) => {
    clearFormMessage();
    setFileError(null);
    const bad = files.map(drawingProblem).find(Boolean);
    if (bad) return setFileError(bad);
    let orderId: string;
    try {
      orderId = (await place.mutateAsync({ quoteId: q.id, ...filled(values) })).id;
    } catch (error) {
      return showServerError(error);
    }
    if (files.length) {
      try {
        await upload.mutateAsync({ id: orderId, files });
      } catch (error) {
        // the order stands; the drawings can be attached on its page
        return setPlacedButUpload({ orderId, message: error instanceof ApiError ? (Object.values(error.fields)[0] ?? error.message) : "The drawings could not be sent." });
      }
    }
    navigate(paths.order.href(orderId));
  });

  const { errors, isSubmitting } = formState;
  const today = new Date().toISOString().slice(0, 10);
  return (
    <div className="grid grid-cols-1 items-start gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
      <Panel title="Order details">
        <form noValidate onSubmit={onSubmit} className="space-y-5">
          {formMessage && (
            <StatusNote tone="danger" word="Not ordered" live="assertive">
              {formMessage}
            </StatusNote>
          )}
          <TextField label="Your purchase order number" autoComplete="off" hint="Printed on the invoice; optional." error={errors.purchaseOrder?.message} {...register("purchaseOrder")} />
          <FieldShell label="Delivery address" error={errors.deliveryAddress?.message} hint="Name, street, town, postcode and country.">
            {({ id, describedBy, invalid }) => <textarea id={id} rows={4} aria-invalid={invalid} aria-describedby={describedBy} autoComplete="shipping street-address" className={`${control} border-nickel-400`} {...register("deliveryAddress")} />}
          </FieldShell>
          <TextField label="Requested delivery date" type="date" min={today} hint={`The shop's lead time is ${q.leadTime_workingDays} working days from payment.`} error={errors.requestedDate?.message} {...register("requestedDate")} />
          <FieldShell label="Notes for the shop" error={errors.notes?.message}>
            {({ id, describedBy, invalid }) => <textarea id={id} rows={3} aria-invalid={invalid} aria-describedby={describedBy} className={`${control} border-nickel-400`} {...register("notes")} />}
          </FieldShell>
          <DrawingPicker files={files} onChange={setFiles} error={fileError} />
          {placedButUpload ? (
            <StatusNote tone="caution" word="Ordered, drawings not attached" live="assertive">
              <p>The order is placed, but the drawings were not attached: {placedButUpload.message}</p>
              <ButtonLink className="mt-2" to={paths.order.href(placedButUpload.orderId)}>
                Go to the order and attach them there
              </ButtonLink>
            </StatusNote>
          ) : (
            <Button type="submit" pending={isSubmitting} pendingLabel={place.isPending ? "Placing the order…" : "Sending the drawings…"}>
              Place the order
            </Button>
          )}
          <p className="text-meta text-flux-600">Next: pay on the payment page. The order waits for payment and can be cancelled until then.</p>
        </form>
      </Panel>
      <Panel title={`Quote ${q.number}`}>
        <dl className="space-y-2">
          <div>
            <dt className="text-meta text-flux-600">Quantity</dt>
            <dd className="font-mono">{q.quantity}</dd>
          </div>
          <div>
            <dt className="text-meta text-flux-600">Total</dt>
            <dd className="font-mono font-semibold">{formatMoney(q.total_cents, q.currency)}</dd>
          </div>
          <div>
            <dt className="text-meta text-flux-600">Valid until</dt>
            <dd className="font-mono">{formatDate(q.expiresAt)}</dd>
          </div>
          <div>
            <dt className="text-meta text-flux-600">Predicted</dt>
            <dd className="font-mono">{q.prediction.attenuation_db.toFixed(1)} dB (needs {q.configuration.requiredAttenuation_db} dB)</dd>
          </div>
        </dl>
      </Panel>
    </div>
  );
}
