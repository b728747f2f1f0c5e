import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { refundCreateSchema, type RefundCreateInput } from "../../../shared/schemas/order";
import { useRefundOrder, type OrderJson } from "../../api/orders";
import { ControlledUnitInput } from "../../components/forms/controlled-unit-input";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";
import { moneyScale } from "../../components/ui/unit-input";
import { formatMoney } from "../../lib/money";
import { useServerErrors } from "../../lib/use-server-errors";

/**
 * The planner's refund: all that is left or a part, with a reason; checked first, then confirmed
 * with the amount in words, since money leaves at once and cannot be called back from here.
 */
export function RefundForm({ order }: { order: OrderJson }) {
  const refund = useRefundOrder();
  const left = order.paid_cents - order.refunded_cents;
  const [asking, setAsking] = useState<RefundCreateInput | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, reset, formState } = useForm<RefundCreateInput>({
    resolver: zodResolver(refundCreateSchema),
    defaultValues: { amount_cents: left, reason: "" },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["amount_cents", "reason"]);
  const money = (c: number) => formatMoney(c, order.currency);

  const confirm = async (values: RefundCreateInput) => {
    clearFormMessage();
    try {
      const updated = await refund.mutateAsync({ id: order.id, ...values });
      setDone(`Refunded ${money(values.amount_cents ?? left)}.${updated.status === "refunded" ? " Everything received is now paid back." : ""}`);
      reset({ amount_cents: updated.paid_cents - updated.refunded_cents, reason: "" });
    } catch (error) {
      showServerError(error);
    } finally {
      setAsking(null);
    }
  };

  if (left <= 0) return <p className="text-flux-600">Everything this order received has been refunded.</p>;
  const { errors } = formState;
  return (
    <form
      noValidate
      className="space-y-4"
      data-testid="refund-form"
      onSubmit={handleSubmit((values) => {
        setDone(null);
        if (values.amount_cents !== undefined && values.amount_cents > left) return setError("amount_cents", { message: `At most ${money(left)} is left to refund.` });
        setAsking(values);
      })}
    >
      <h3 className="text-h4">Refund</h3>
      <p className="text-meta text-flux-600">
        {money(left)} left to refund of {money(order.paid_cents)} received. The refund goes back to the card it came from.
      </p>
      {formMessage && (
        <StatusNote tone="danger" word="Not refunded" live="assertive">
          {formMessage}
        </StatusNote>
      )}
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-[12rem_minmax(0,1fr)]">
        <ControlledUnitInput control={control} errors={errors} name="amount_cents" label="Amount" scale={moneyScale(order.currency)} />
        <TextField label="Reason" hint="The customer sees it on the order." error={errors.reason?.message} {...register("reason")} />
      </div>
      {asking ? (
        <div className="space-y-2 rounded-md border border-caution-200 bg-caution-50 p-3" role="group" aria-label="Confirm the refund">
          <p className="text-caution-900">
            Refund <strong>{money(asking.amount_cents ?? left)}</strong> of order {order.number} to the customer, because “{asking.reason}”? The money leaves at once; this cannot be undone here.
          </p>
          <div className="flex flex-wrap gap-2">
            <Button variant="danger" pending={refund.isPending} pendingLabel="Refunding…" onClick={() => void confirm(asking)}>
              Refund {money(asking.amount_cents ?? left)}
            </Button>
            <Button variant="secondary" onClick={() => setAsking(null)} autoFocus>
              Do not refund
            </Button>
          </div>
        </div>
      ) : (
        <Button type="submit" variant="secondary">
          Refund…
        </Button>
      )}
      {done && (
        <StatusNote tone="ok" word="Refunded" live="polite">
          {done}
        </StatusNote>
      )}
    </form>
  );
}
