// Document numbers come from database sequences (integers); people read them with a prefix.

export const DOCUMENT_PREFIX = { quote: "Q", order: "O", invoice: "INV" } as const;
export type NumberedDocument = keyof typeof DOCUMENT_PREFIX;

export function documentNumber(kind: NumberedDocument, n: number): string {
  return `${DOCUMENT_PREFIX[kind]}-${n}`;
}

/** "Q-1042", "q1042" or "1042" → 1042 (searching by number); null when it is no number. */
export function parseDocumentNumber(text: string): number | null {
  const m = /^\s*(?:[a-z]+\s*-?\s*)?(\d{1,9})\s*$/i.exec(text);
  return m ? Number(m[1]) : null;
}

/** Money for people: integer cents in an ISO 4217 currency. */
export function formatMoney(cents: number, currency: string, locale = "en-GB"): string {
  return new Intl.NumberFormat(locale, { style: "currency", currency }).format(cents / 100);
}
