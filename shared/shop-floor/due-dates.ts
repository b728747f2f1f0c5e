/** Due dates: the customer's requested date, else the quoted lead time in working days (Monday to Friday) from payment. */

const DAY_MS = 86_400_000;

/** A calendar day as YYYY-MM-DD (UTC). */
export const isoDay = (d: Date) => d.toISOString().slice(0, 10);

/** The day `n` working days after `from` (weekends skipped; the shop's holidays are not known here). */
export function addWorkingDays(from: Date, n: number): Date {
  let d = new Date(Date.UTC(from.getUTCFullYear(), from.getUTCMonth(), from.getUTCDate()));
  let left = Math.max(0, Math.round(n));
  while (left > 0) {
    d = new Date(d.getTime() + DAY_MS);
    const wd = d.getUTCDay();
    if (wd !== 0 && wd !== 6) left--;
  }
  return d;
}

/** When an order's jobs are due: the requested date when the customer gave one, else payment + lead time. */
export function dueDate(props: { requestedDate: string | null; paidAt: Date | null; releasedAt: Date; leadTime_workingDays: number }): string {
  if (props.requestedDate) return props.requestedDate;
  return isoDay(addWorkingDays(props.paidAt ?? props.releasedAt, props.leadTime_workingDays));
}
