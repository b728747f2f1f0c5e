// The answer's figures in words: the chart's written summary and the short texts of the tables.

import type { DesignCandidateJson } from "../../../shared/schemas/design-advice";
import { formatMoney } from "../../lib/money";

const fmt = (x: number, digits = 3) => String(+x.toPrecision(digits));

export const dbText = (db: number) => `${db.toFixed(1)} dB`;
export const kgText = (kg: number) => (kg < 1 ? `${fmt(kg * 1000, 3)} g` : `${fmt(kg, 3)} kg`);
export const moneyText = (cents: number, currency: string) => formatMoney(cents, currency);
export const bandText = (c: Pick<DesignCandidateJson, "band">) => `${c.band.low_db.toFixed(0)}–${c.band.high_db.toFixed(0)} dB`;

/** "63 × 132 mm" (a can: diameter × length; a box: width × depth × height). */
export function outsideText(c: Pick<DesignCandidateJson, "outside_mm" | "configuration">): string {
  const o = c.outside_mm;
  const keys = c.configuration.shape === "box" ? ["width", "depth", "height"] : ["diameter", "length"];
  return `${keys.map((k) => fmt(o[k], 4)).join(" × ")} mm`;
}

/** The smallest layer margin as the trade says it: "23× below saturation", or "cannot saturate". */
export function marginText(c: Pick<DesignCandidateJson, "saturationMargin">): string {
  return c.saturationMargin === null ? "cannot saturate" : `${fmt(c.saturationMargin, 2)}×`;
}

const range = (xs: number[], show: (x: number) => string) => {
  const lo = Math.min(...xs), hi = Math.max(...xs);
  return lo === hi ? show(lo) : `${show(lo)} to ${show(hi)}`;
};

/** The chart in words: how many designs, the spread of price and attenuation, the front, the recommendation. */
export function adviceSummary(candidates: DesignCandidateJson[], recommended: number | null, required_db: number, evaluated: number): string {
  if (!candidates.length) return `None of the ${evaluated.toLocaleString("en-GB")} designs tried reaches ${dbText(required_db)} at the low end of its likely range.`;
  const currency = candidates[0].currency;
  const front = candidates.filter((c) => c.front);
  const cheapest = candidates.reduce((a, b) => (b.unitPrice_cents < a.unitPrice_cents ? b : a));
  const strongest = candidates.reduce((a, b) => (b.attenuation_db > a.attenuation_db ? b : a));
  const parts = [
    `${candidates.length} design${candidates.length === 1 ? "" : "s"} shown of the ${evaluated.toLocaleString("en-GB")} tried, each reaching the ${dbText(required_db)} asked at the low end of its likely range;`,
    `unit prices ${range(candidates.map((c) => c.unitPrice_cents), (x) => moneyText(x, currency))}, attenuation as built ${range(candidates.map((c) => c.attenuation_db), (x) => dbText(x))}.`,
    `${front.length} ${front.length === 1 ? "is" : "are"} on the front (no other design is cheaper, lighter and stronger at once).`,
    `The cheapest is ${cheapest.summary} at ${moneyText(cheapest.unitPrice_cents, currency)} (${dbText(cheapest.attenuation_db)});`,
    `the strongest ${strongest.summary} at ${moneyText(strongest.unitPrice_cents, currency)} (${dbText(strongest.attenuation_db)}).`,
  ];
  const pick = recommended !== null ? candidates[recommended] : undefined;
  if (pick) parts.push(`Recommended: ${pick.summary}, ${moneyText(pick.unitPrice_cents, currency)}, ${dbText(pick.attenuation_db)}.`);
  return parts.join(" ");
}
