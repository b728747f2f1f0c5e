// The front table's order: by any of its figures, either way, ties broken by price (then the
// design's own words) so an equal figure never shuffles the rows between renders.

import type { DesignCandidateJson } from "../../../shared/schemas/design-advice";

export const frontSortKeys = ["price", "attenuation", "low", "mass", "outside", "layers"] as const;
export type FrontSortKey = (typeof frontSortKeys)[number];

export interface FrontSort {
  key: FrontSortKey;
  descending: boolean;
}

/** Cheapest first: the order a buyer reads a front in. */
export const defaultFrontSort: FrontSort = { key: "price", descending: false };

/** The largest outside dimension: what decides whether it fits the space round it. */
export const largestOutside = (c: DesignCandidateJson) => Math.max(...Object.values(c.outside_mm));

const figure: Record<FrontSortKey, (c: DesignCandidateJson) => number> = {
  price: (c) => c.unitPrice_cents,
  attenuation: (c) => c.attenuation_db,
  low: (c) => c.band.low_db,
  mass: (c) => c.mass_kg,
  outside: largestOutside,
  layers: (c) => c.configuration.layers.length,
};

/** A sorted copy, each row with its index in the answer (the recommendation is named by index). */
export function sortFront(candidates: readonly DesignCandidateJson[], sort: FrontSort): Array<{ candidate: DesignCandidateJson; index: number }> {
  const by = figure[sort.key];
  const sign = sort.descending ? -1 : 1;
  return candidates
    .map((candidate, index) => ({ candidate, index }))
    .sort((a, b) => sign * (by(a.candidate) - by(b.candidate)) || a.candidate.unitPrice_cents - b.candidate.unitPrice_cents || a.candidate.summary.localeCompare(b.candidate.summary));
}

/** Clicking a column: a new column sorts its natural way (more attenuation first, less of the rest first); the same column again turns the order round. */
export function nextSort(current: FrontSort, key: FrontSortKey): FrontSort {
  if (current.key === key) return { key, descending: !current.descending };
  return { key, descending: key === "attenuation" || key === "low" };
}
