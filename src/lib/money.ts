import { amountFromCents } from "../../shared/units";

const formats = new Map<string, Intl.NumberFormat>();

/** The one minus sign of the app (U+2212), the width of a plus and never broken from its number. */
export const MINUS = "\u2212";

/** A signed figure written with the app's minus sign ("−3.5"). */
export function withMinus(text: string): string {
  return text.replace(/^-/, MINUS).replace(/^(\P{N}*)-/u, `$1${MINUS}`);
}

/** Integer cents in the list's currency, e.g. 123456 EUR → "€1,234.56"; −900 → "−€9.00". */
export function formatMoney(cents: number, currency: string): string {
  let f = formats.get(currency);
  if (!f) {
    f = new Intl.NumberFormat("en-GB", { style: "currency", currency });
    formats.set(currency, f);
  }
  const text = f.format(amountFromCents(Math.abs(cents), currency));
  // −0 and 0 both read "€0.00"
  return cents < 0 ? `${MINUS}${text}` : text;
}
