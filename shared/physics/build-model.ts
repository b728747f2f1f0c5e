// The as-built model: what keeps a built shield below the exact seamless shell, with every free
// parameter named so that the shop's measured lots can set it later.
//
//   1/S_as-built = 1/S_walls + 1/S_ceiling (+ the cable holes' leaks)
//
// S_walls is the exact core with each layer weakened by its lid joint and its welds; S_ceiling
// is the construction ceiling, a shop setting per construction. Both are estimates [practice];
// the derivations are beside each term.

import { DEFAULT_LID_CLEARANCE_MM, LID_OVERLAP_FRACTION, LID_OVERLAP_MIN_MM } from "../construction-defaults";
import { demagnetizingFactor } from "./thin";

export type Construction = "closed-can" | "open-tube" | "box" | "sphere";
export type BuildMethod = "drawn" | "rolled" | "bent";

export const CONSTRUCTIONS: readonly Construction[] = ["closed-can", "open-tube", "box", "sphere"];
export const CONSTRUCTION_WORDS: Record<Construction, string> = {
  "closed-can": "closed can with a slip-on lid",
  "open-tube": "open tube",
  box: "box with a slip-on lid",
  sphere: "sphere of two welded halves",
};
export const METHOD_WORDS: Record<BuildMethod, string> = { drawn: "deep-drawn", rolled: "rolled and seam-welded", bent: "bent and corner-welded" };

/** The ceiling a construction levels off at: dB for one layer, and what each further nested layer adds. */
export interface CeilingSetting {
  firstLayer_db: number;
  perExtraLayer_db: number;
}

/** The shop setting (kept in the versioned shop-rates document). */
export interface ConstructionSettings {
  ceilings: Record<Construction, CeilingSetting>;
  /** radial clearance between a lid's skirt and the body */
  lidClearance_mm: number;
  /** the lid's skirt overlaps the body by this share of the inside length (or height), at least lidOverlapMin_mm */
  lidOverlapFraction: number;
  lidOverlapMin_mm: number;
}

/**
 * Defaults from practice [practice]/[memory]: built single cans of nickel-iron level off around
 * 65–75 dB whatever the walls would allow (lid fit, handling after the anneal, the last seam),
 * and each further nested layer adds about 20 dB to what the nest can reach; boxes level off
 * lower. The lid fit is the one the flat-blank engine makes (0.2 mm clearance, a skirt a
 * quarter of the height, at least 10 mm).
 */
export const DEFAULT_CONSTRUCTION_SETTINGS: ConstructionSettings = {
  ceilings: {
    "closed-can": { firstLayer_db: 70, perExtraLayer_db: 20 },
    "open-tube": { firstLayer_db: 70, perExtraLayer_db: 20 },
    box: { firstLayer_db: 60, perExtraLayer_db: 20 },
    sphere: { firstLayer_db: 75, perExtraLayer_db: 20 },
  },
  lidClearance_mm: DEFAULT_LID_CLEARANCE_MM,
  lidOverlapFraction: LID_OVERLAP_FRACTION,
  lidOverlapMin_mm: LID_OVERLAP_MIN_MM,
};

/** A fusion weld (no filler) after the final anneal: a zone a few thicknesses wide at a fraction of the wall's μ. [practice] */
export interface WeldSetting {
  zoneWidthPerThickness: number;
  muFraction: number;
}

/** How far the as-built parameters usually stray: the band. Measured lots will replace it with their own spread. */
export interface BuildSpread {
  /** the effective μ from muLow to muHigh times the design value */
  muLow: number;
  muHigh: number;
  /** the ceiling ± this */
  ceiling_db: number;
  /** the lid clearance from ×factor to ÷factor */
  clearanceFactor: number;
  basis: string;
}

/** What a prediction says of the shop's calibration of its class (the answer's `calibration`). */
export interface CalibrationNote {
  /** shop: the class's parameters are fitted to its measured lots; library: the lots did not (yet) earn it */
  source: "shop" | "library";
  lots: number;
  fittedAt: string;
  /** the stored fit (a quote's prediction names the one it used) */
  fitId?: string;
}

/**
 * The shop's calibration of one class, alloy × forming method × construction: the parameters
 * fitted to its measured lots (shared/calibration). A class's fit applies to the designs whose
 * outermost layer is of its alloy: μ to the layers of that alloy, the ceiling to the nest, the
 * band to the figure; other alloys' layers keep their library μ (that is how the fit was made).
 * A fit without parameters is a class whose lots did not earn a calibration: the library values
 * stand and the answer says so.
 */
export interface BuildFit {
  material: string;
  method: BuildMethod;
  construction: Construction;
  /** effective low-field μ (scales the alloy's μ(B) table) */
  mu_effective?: number;
  /** the construction ceiling of one layer for this alloy and method, replacing the shop setting */
  ceiling_db?: number;
  /** the band from the cross-validated errors: how far below and above the figure a lot falls, dB */
  band_db?: { below: number; above: number; basis: string };
  calibration?: CalibrationNote;
  /** the stored fit (a quote names the one it used) */
  id?: string;
}

export interface BuildModel extends ConstructionSettings {
  weld: WeldSetting;
  spread: BuildSpread;
  /** at most one per class */
  fits?: BuildFit[];
}

export const DEFAULT_WELD: WeldSetting = { zoneWidthPerThickness: 3, muFraction: 1 / 3 };

export const DEFAULT_SPREAD: BuildSpread = {
  muLow: 0.6,
  muHigh: 1.5,
  ceiling_db: 6,
  clearanceFactor: 2,
  basis:
    "the as-built model with its parameters across their usual spread: effective μ from 0.6 to 1.5 times the design value, the construction ceiling ± 6 dB, the lid clearance from twice to half the shop's figure [practice]",
};

/** The shop's settings with the model's defaults for the rest. */
export function buildModelFrom(settings: ConstructionSettings, extra: Partial<Pick<BuildModel, "fits" | "spread" | "weld">> = {}): BuildModel {
  return { ...settings, weld: extra.weld ?? DEFAULT_WELD, spread: extra.spread ?? DEFAULT_SPREAD, ...(extra.fits?.length ? { fits: extra.fits } : {}) };
}

export const DEFAULT_BUILD_MODEL: BuildModel = buildModelFrom(DEFAULT_CONSTRUCTION_SETTINGS);

export function constructionOf(shape: "cylinder" | "box" | "sphere", ends: "closed" | "open"): Construction {
  if (shape === "box") return "box";
  if (shape === "sphere") return "sphere";
  return ends === "open" ? "open-tube" : "closed-can";
}

/** The method a shape is made by when the request names none, and the methods it can be made by. */
export const METHODS_FOR: Record<"cylinder" | "box" | "sphere", readonly BuildMethod[]> = {
  cylinder: ["drawn", "rolled"],
  box: ["bent"],
  sphere: ["drawn"],
};

export function fitFor(model: BuildModel, material: string | null | undefined, method: BuildMethod, construction: Construction): BuildFit | undefined {
  if (!material || !model.fits) return undefined;
  return model.fits.find((f) => f.material === material && f.method === method && f.construction === construction);
}

/** The fit's parameters are in use (a fit without any is the library's). */
export const fitInUse = (fit: BuildFit | undefined): fit is BuildFit => fit !== undefined && (fit.mu_effective !== undefined || fit.ceiling_db !== undefined);

/** The class a design belongs to: its outermost layer's alloy (it meets the field first), method and construction. */
export function classOf(design: { shape: "cylinder" | "box" | "sphere"; ends?: "closed" | "open"; method?: BuildMethod; layers: readonly { material?: string | null }[] }): {
  material: string | null;
  method: BuildMethod;
  construction: Construction;
} {
  const outer = design.layers[design.layers.length - 1];
  return {
    material: outer?.material ?? null,
    method: design.method ?? METHODS_FOR[design.shape][0],
    construction: constructionOf(design.shape, design.shape === "cylinder" ? (design.ends ?? "closed") : "closed"),
  };
}

/** The ceiling in dB for `layers` nested layers (a fitted one replaces the shop setting). */
export function ceiling_db(model: BuildModel, construction: Construction, layers: number, fitted?: number): number {
  const c = model.ceilings[construction];
  return (fitted ?? c.firstLayer_db) + Math.max(0, layers - 1) * c.perExtraLayer_db;
}

/** The lid's overlap on a body of inside length (or height) `length_mm`. */
export function lidOverlap_mm(model: ConstructionSettings, length_mm: number): number {
  return Math.min(length_mm, Math.max(model.lidOverlapMin_mm, model.lidOverlapFraction * length_mm));
}

/**
 * Lid joint, flux across it (a can or box in a field along its axis or height). The flux that
 * runs along the wall must cross the clearance g over the overlap ℓ: a reluctance
 * g/(μ0·πD·ℓ) in series with the wall's L/(μ0·μ·πD·t). With S − 1 = 4N·μt/D (Mager) read as
 * inversely proportional to the path's reluctance,
 *   1/(S − 1) = D/(4N·μ·t) + g·D/(4N·ℓ·L),
 * so the joint alone limits the can to S_lid = 4N·ℓ·L/(g·D), whatever μ is. [derived]
 */
export function lidJointAlong(overlap_mm: number, length_mm: number, diameter_mm: number, clearance_mm: number): number {
  const N = demagnetizingFactor(length_mm / diameter_mm);
  return (4 * N * overlap_mm * length_mm) / (clearance_mm * diameter_mm);
}

/**
 * Lid joint, field across the axis: the end cap hands its flux (gathered over its diameter) to
 * the wall through the clearance, which leaves about H0·g/ℓ at the cap; that field decays into
 * the can as exp(−j·z/a) toward the middle, z = L/2. S_lid = (ℓ/g)·exp(j·(L/2)/a). [derived]
 */
export function lidJointAcross(overlap_mm: number, length_mm: number, radius_mm: number, clearance_mm: number, root: number): number {
  return (overlap_mm / clearance_mm) * Math.exp(Math.min(700, (root * length_mm) / 2 / radius_mm));
}

/**
 * A weld across the flux path: its zone (width w at μ·muFraction) adds the equivalent of
 * Δs = w·(1/muFraction − 1) of wall to the path. [derived]
 */
export function weldPath_mm(weld: WeldSetting, thickness_mm: number): number {
  return weld.zoneWidthPerThickness * thickness_mm * (1 / weld.muFraction - 1);
}

/**
 * How much a layer's flux-shunting falls for extra path Δs in one of the two half paths
 * (length s each, in parallel) of a field across the wall: the reluctance R becomes
 * R(R+ΔR)/(2R+ΔR) against R/2. [derived]
 */
export const oneSidedPathFactor = (extra_mm: number, halfPath_mm: number): number => {
  const x = extra_mm / halfPath_mm;
  return (2 * (1 + x)) / (2 + x);
};
