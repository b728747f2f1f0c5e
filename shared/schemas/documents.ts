// Document numbers come from database sequences (integers); people read them with a prefix.

export const DOCUMENT_PREFIX = { quote: "Q", order: "O", invoice: "INV" } as const;
export type NumberedDocument = keyof typeof DOCUMENT_PREFIX;

export function documentNumber(kind: NumberedDocument, n: number): string {
  return `${DOCUMENT_PREFIX[kind]}-${n}`;
}

/**
 * A document number typed into a search: "Q-1042", "q1042" or "1042" → 1042, with the kind its
 * prefix names (null when the number came bare); null when it is no number.
 */
export function parseDocumentNumber(text: string): { n: number; kind: NumberedDocument | null } | null {
  const m = /^\s*(?:([a-z]+)\s*-?\s*)?(\d{1,9})\s*$/i.exec(text);
  if (!m) return null;
  const prefix = m[1]?.toUpperCase();
  const kind = (Object.keys(DOCUMENT_PREFIX) as NumberedDocument[]).find((k) => DOCUMENT_PREFIX[k] === prefix) ?? null;
  if (prefix && !kind) return null;
  return { n: Number(m[2]), kind };
}

/** Money for people: integer cents in an ISO 4217 currency. */
export function formatMoney(cents: number, currency: string, locale = "en-GB"): string {
  return new Intl.NumberFormat(locale, { style: "currency", currency }).format(cents / 100);
}
