// The sentences of the answer: why the recommendation, and what the closest design lacks.

import type { Shortfall } from "../schemas/design-advice";

export const money = (cents: number, currency: string) => `${(cents / 100).toFixed(2)} ${currency}`;
const db = (x: number) => `${x.toFixed(1)} dB`;
const fmt = (x: number) => String(+x.toPrecision(3));

/** "a third" for the trade's rule of 3, else "1/x". */
export function marginWords(minMargin: number): string {
  const names: Record<number, string> = { 1: "all", 2: "half", 3: "a third", 4: "a quarter", 5: "a fifth" };
  return names[minMargin] ?? `1/${fmt(minMargin)}`;
}

export interface ExplainedDesign {
  summary: string;
  unitPrice_cents: number;
  currency: string;
  attenuation_db: number;
  band: { low_db: number; high_db: number };
  layers: { material: string; thickness_mm: number; wallFluxDensity_T: number; saturationMargin: number | null }[];
}

export function recommendationReason(props: {
  pick: ExplainedDesign;
  onFront: boolean;
  frontSize: number;
  /** front designs cheaper than the pick, all of which break the margin */
  cheaperBreakingMargin: number;
  required_db: number;
  minMargin: number;
}): string {
  const { pick, required_db, minMargin } = props;
  const rule = `every layer's peak wall flux at or below ${marginWords(minMargin)} of its saturation`;
  const what = `${pick.summary}, ${money(pick.unitPrice_cents, pick.currency)} each, about ${db(pick.attenuation_db)} built (likely ${db(pick.band.low_db)} to ${db(pick.band.high_db)}): even the low end meets the ${db(required_db)} asked`;
  if (!props.onFront) return `No design on the price–mass–attenuation front keeps ${rule}, so this is the cheapest design that does: ${what}.`;
  const skipped =
    props.cheaperBreakingMargin > 0
      ? ` ${props.cheaperBreakingMargin === 1 ? "The one cheaper design on the front runs" : `The ${props.cheaperBreakingMargin} cheaper designs on the front run`} a layer past that margin.`
      : "";
  return `The cheapest of the ${props.frontSize} design${props.frontSize === 1 ? "" : "s"} on the price–mass–attenuation front that keeps ${rule}: ${what}.${skipped}`;
}

export function noRecommendationReason(props: { anyMeets: boolean; required_db: number; minMargin: number; anyMade: boolean }): string {
  if (!props.anyMade) return "No design of the shop's stock can be made for this space within the constraints; allow more alloys, gauges or room.";
  if (props.anyMeets)
    return `Designs reach ${db(props.required_db)}, but every one runs a layer past ${marginWords(props.minMargin)} of its saturation in this field; the closest is shown with what it lacks.`;
  return `No design the shop makes within the constraints reaches ${db(props.required_db)} at the low end of its band; the closest is shown with what it lacks.`;
}

export function lacksSentence(s: Shortfall, d: ExplainedDesign, required_db: number, minMargin: number): string {
  const parts: string[] = [];
  if (s.db !== undefined) parts.push(`${db(s.db)} short at the low end of its band (${db(d.band.low_db)} against the ${db(required_db)} asked)`);
  for (const i of s.saturatedLayers ?? []) {
    const l = d.layers[i];
    const sat = l.saturationMargin === null ? null : l.wallFluxDensity_T * l.saturationMargin;
    const against = sat === null ? "" : l.wallFluxDensity_T >= sat ? `, above its ${fmt(sat)} T saturation` : `, more than ${marginWords(minMargin)} of its ${fmt(sat)} T saturation`;
    parts.push(`saturates: layer ${i + 1} (${fmt(l.thickness_mm)} mm ${l.material}) would carry ${fmt(l.wallFluxDensity_T)} T at its peak${against}`);
  }
  const over = Object.entries(s.oversize_mm ?? {});
  if (over.length) parts.push(`too big: ${over.map(([k, mm]) => `${fmt(mm)} mm over the largest outside ${k}`).join(", ")}`);
  if (s.overMass_kg !== undefined) parts.push(`too heavy: ${fmt(s.overMass_kg)} kg over the largest mass`);
  return parts.length ? `${parts.join("; ")}.` : "Nothing: it meets the requirement.";
}
