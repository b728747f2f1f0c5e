const formats = new Map<string, Intl.NumberFormat>();

/** Integer cents in the list's currency, e.g. 123456 EUR → "€1,234.56". */
export function formatMoney(cents: number, currency: string): string {
  let f = formats.get(currency);
  if (!f) {
    f = new Intl.NumberFormat("en-GB", { style: "currency", currency });
    formats.set(currency, f);
  }
  return f.format(cents / 100);
}
