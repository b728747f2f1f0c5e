// A design's as-built figure as a function of the class's two parameters, worked out by the real
// engine: for each effective μ on a grid the engine gives the terms the ceiling combines with
// (ceilingResponse), and responseDb combines them with any ceiling as predictShield does. Between
// grid points the terms are read off monotone cubics in ln μ (smooth there: S grows about as μ),
// so the fit can try thousands of parameter pairs at the cost of one engine call per grid point.
// The errors a fit reports are always from the engine itself at the fitted μ (exactResponse).

import type { BuildFit, BuildModel } from "../physics/build-model";
import { ceilingResponse, responseDb, type CeilingResponse, type MaterialLookup, type PredictionInput } from "../physics/predict";
import { pchip, pchipAt, type Pchip } from "./interpolate";
import type { ClassKey } from "./types";

/** The grid spans a tenth to ten times the library's μ (a fit beyond it is refused as not converged). */
export const GRID_DECADES = 1;
/** points on the grid, the library's μ in the middle */
export const GRID_POINTS = 17;

export interface ResponseGrid {
  /** ln μ at the first point and the spacing */
  x0: number;
  h: number;
  lnWalls: Pchip;
  lnCore: Pchip;
  lnIdeal: Pchip;
  lnHoles: Pchip;
  extraLayers_db: number;
  /** the engine's own response at the library's μ (the middle point) */
  atLibrary: CeilingResponse;
}

/** The model with the class's μ set (the ceiling is given to responseDb). */
export function modelWithMu(model: BuildModel, key: ClassKey, mu: number): BuildModel {
  const fit: BuildFit = { material: key.material, method: key.method, construction: key.construction, mu_effective: mu };
  return { ...model, fits: [fit] };
}

export function exactResponse(input: PredictionInput, materials: MaterialLookup, model: BuildModel, key: ClassKey, mu: number): CeilingResponse {
  return ceilingResponse(input, materials, modelWithMu(model, key, mu));
}

export function responseGrid(input: PredictionInput, materials: MaterialLookup, model: BuildModel, key: ClassKey, libraryMu: number): ResponseGrid {
  const n = GRID_POINTS;
  const span = GRID_DECADES * Math.LN10;
  const x0 = Math.log(libraryMu) - span;
  const h = (2 * span) / (n - 1);
  const mid = (n - 1) / 2;
  const terms = { lnWalls: new Float64Array(n), lnCore: new Float64Array(n), lnIdeal: new Float64Array(n), lnHoles: new Float64Array(n) };
  let extra = 0;
  let atLibrary: CeilingResponse | null = null;
  for (let i = 0; i < n; i++) {
    // the middle point is the library's μ exactly, so the library's figure is the engine's own
    const r = exactResponse(input, materials, model, key, i === mid ? libraryMu : Math.exp(x0 + i * h));
    if (i === mid) atLibrary = r;
    terms.lnWalls[i] = r.lnWalls;
    terms.lnCore[i] = r.lnCore;
    terms.lnIdeal[i] = r.lnIdeal;
    terms.lnHoles[i] = r.lnHoles;
    extra = r.extraLayers_db;
  }
  return {
    x0, h,
    lnWalls: pchip(x0, h, terms.lnWalls), lnCore: pchip(x0, h, terms.lnCore), lnIdeal: pchip(x0, h, terms.lnIdeal), lnHoles: pchip(x0, h, terms.lnHoles),
    extraLayers_db: extra, atLibrary: atLibrary!,
  };
}

/** The response at ln μ = x, read off the grid. */
export function responseAt(g: ResponseGrid, x: number): CeilingResponse {
  return { lnWalls: pchipAt(g.lnWalls, x), lnCore: pchipAt(g.lnCore, x), lnIdeal: pchipAt(g.lnIdeal, x), lnHoles: pchipAt(g.lnHoles, x), extraLayers_db: g.extraLayers_db };
}

export const gridDb = (g: ResponseGrid, x: number, ceiling1_db: number): number => responseDb(responseAt(g, x), ceiling1_db);

/** The grid's ends in ln μ. */
export const gridRange = (g: ResponseGrid): [number, number] => [g.x0, g.x0 + g.h * (GRID_POINTS - 1)];
