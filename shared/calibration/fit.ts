// The fit of one class (alloy × forming method × construction) to its measured lots: the effective
// low-field μ and the one-layer construction ceiling, by least squares on dB over every part of
// every lot, each lot counting once (a part weighs 1/parts of its lot), through the real engine
// (1/S = 1/S_walls + 1/S_ceiling, see response-grid.ts).
//
// Robustness, in two steps [pub: Huber, Ann. Math. Stat. 35:73, 1964; Iglewicz & Hoaglin, How to
// Detect and Handle Outliers, ASQC 1993]:
// 1. Huber's loss (k = 1.345 robust σ), by reweighting, so that no single wild value pulls the
//    start of the fit;
// 2. trimming by modified z-scores, |x − median| / (1.4826·MAD) > 3.5: a PART that reads far from
//    the rest of its lot (a knocked or mishandled part; lots of 3 or more parts, never half of a
//    lot) and a LOT whose median error is far from the other lots' (re-annealed, a furnace or
//    material problem; classes of 5 or more lots, at most a fifth of them). The trimmed parts and
//    lots are listed with the reason and left out of the refit; the errors below still count them.
//
// Identifiability: both parameters are fitted only when the lots tell them apart, i.e. lots of at
// least two designs or test frequencies, the ceiling carrying a share of some lot's leakage, μ
// moving some lot's figure, and the two estimates correlated by less than 0.98. Otherwise μ only
// is fitted (the ceiling keeps the shop's setting), or, when no lot's figure moves with μ at all,
// the ceiling only; the fit says which and why.
//
// Honesty: the median absolute error of predicted against measured dB with the library's values,
// with the fit on the same lots, and in k-fold cross-validation by lots (each lot predicted by a
// fit, trimming included, that had not seen it): the last is the figure that counts. A fit is used
// only with enough lots (the shop setting) and when it beats the library in cross-validation.
// The band then comes from the spread of the cross-validated errors.

import type { BuildModel, CalibrationNote } from "../physics/build-model";
import { PredictionInputError, responseDb, type MaterialLookup, type PredictionInput } from "../physics/predict";
import { levenbergMarquardt, type LeastSquaresModel } from "./least-squares";
import { exactResponse, gridRange, responseAt, responseGrid, type ResponseGrid } from "./response-grid";
import { hashText, MAD_TO_SIGMA, mean, median, medianAbs, normalQuantile, robustSigma, seededRandom } from "./stats";
import { CALIBRATION_DEFAULTS, classKeyText, type ClassKey, type MeasuredLot } from "./types";

/** Below this a robust σ is taken as this (dB): the instruments' resolution, so near-perfect data flag nothing. [practice] */
export const MIN_SCALE_DB = 0.25;
export const HUBER_K = 1.345;
export const OUTLIER_Z = 3.5;
/** the one-layer ceilings a fit may take, dB */
export const CEILING_RANGE_DB: [number, number] = [20, 160];
/** the band: 90 % of lots, from the cross-validated errors */
export const BAND_COVERAGE = 0.9;
const IDENTIFIABLE_CORRELATION = 0.98;
/** ∂dB/∂ceiling: the ceiling's share of the leakage; below this in every lot it cannot be fitted */
const CEILING_LEVERAGE = 0.05;
/** ∂dB/∂ln μ, dB per e-fold; below this in every lot μ cannot be fitted */
const MU_LEVERAGE = 0.2;

export type FitMode = "mu-and-ceiling" | "mu-only" | "ceiling-only";

export interface LeftOut {
  lotId: string;
  lotNumber: string;
  kind: "lot" | "part";
  /** the part's serial (kind "part") */
  serial?: string;
  /** how far it reads from the rest, dB (measured minus the rest's level) */
  deviation_db: number;
  /** the modified z-score */
  z: number;
  reason: string;
}

/** One lot on the measured-against-predicted scatter (means over its parts). */
export interface LotPoint {
  lotId: string;
  number: string;
  measured_db: number;
  library_db: number;
  fitted_db: number;
  crossValidated_db: number;
  leftOut: "lot" | "parts" | null;
}

export interface ClassFit extends ClassKey {
  /** lots the fit is made on (outliers left out) */
  lots: number;
  /** lots of the class measured, outliers included */
  lotsMeasured: number;
  parts: number;
  lotsUsed: string[];
  leftOut: LeftOut[];
  /** parts the engine could not predict (their design is refused), left out */
  unpredictable: number;
  /** distinct designs × test frequencies × orientations */
  conditions: number;
  mode: FitMode;
  /** in words: what the lots could tell apart */
  identifiability: string;
  library: { mu_effective: number; ceiling_db: number };
  mu_effective: number;
  ceiling_db: number;
  /** standard uncertainties (one σ) from the lots' scatter; null where not fitted or too few lots */
  uncertainty: { mu_effective: number | null; ceiling_db: number | null; correlation: number | null; basis: string };
  /** median absolute error of predicted against measured dB over every measured part */
  error_db: { library: number; fitted: number; crossValidated: number };
  folds: number;
  band_db: { below: number; above: number; basis: string };
  converged: boolean;
  inUse: boolean;
  /** why it is used or not, in a sentence */
  verdict: string;
  points: LotPoint[];
}

export interface FitShop {
  materials: MaterialLookup;
  /** the shop's construction settings with no fits: other alloys' layers keep the library's μ */
  model: BuildModel;
  minLots?: number;
  folds?: number;
}

interface Row {
  lot: number;
  cond: number;
  measured: number;
  serial: string;
}

type Free = [boolean, boolean];
const FREE: Record<FitMode, Free> = { "mu-and-ceiling": [true, true], "mu-only": [true, false], "ceiling-only": [false, true] };

interface RobustResult {
  theta: [number, number];
  retained: Uint8Array;
  leftOut: { row?: number; lot?: number; deviation: number; z: number }[];
  converged: boolean;
}

/** Fixed digits, and never a "-0.0". */
const fmt = (x: number, digits = 2) => (Math.abs(x) < 0.5 * 10 ** -digits ? 0 : x).toFixed(digits);

/** The alloy's library value of the parameter fitted: its μ table's low-field value. */
export function libraryMuOf(materials: MaterialLookup, id: string): number | null {
  const m = Array.isArray(materials) ? materials.find((x) => x.id === id) : materials(id);
  if (!m) return null;
  // a non-magnetic metal has no μ to fit
  if (m.saturation_T == null || m.relativePermeability.maximum <= m.relativePermeability.initial) return null;
  return m.muCurve[0]?.mu_r ?? m.relativePermeability.initial;
}

/**
 * Fits one class, yielding between pieces of work so that a server can slice it; `fitClass`
 * runs it to the end. `lots` are the class's lots (each part's design of this class).
 */
export function* fitClassSteps(key: ClassKey, lots: MeasuredLot[], shop: FitShop): Generator<void, ClassFit | null> {
  const libraryMu = libraryMuOf(shop.materials, key.material);
  if (libraryMu === null) return null;
  const libraryCeiling = shop.model.ceilings[key.construction].firstLayer_db;
  const minLots = shop.minLots ?? CALIBRATION_DEFAULTS.minLots;

  // the distinct engine inputs (design, frequency, field, direction), each worked out once
  const condIndex = new Map<string, number>();
  const inputs: PredictionInput[] = [];
  const rows: Row[] = [];
  const lotIds: string[] = [];
  let unpredictable = 0;
  const refused = new Set<number>();
  lots.forEach((lot, li) => {
    lotIds.push(lot.lotId);
    for (const part of lot.parts) {
      const input: PredictionInput = {
        ...part.design,
        field: { frequency_hz: part.frequency_hz, amplitude_uT: part.appliedField_uT, orientation: part.orientation ?? "transverse" },
        state: "annealed",
      };
      const text = JSON.stringify(input);
      let c = condIndex.get(text);
      if (c === undefined) condIndex.set(text, (c = inputs.push(input) - 1));
      rows.push({ lot: li, cond: c, measured: part.measured_db, serial: part.serial });
    }
  });

  const grids: (ResponseGrid | null)[] = [];
  for (let c = 0; c < inputs.length; c++) {
    try {
      grids.push(responseGrid(inputs[c], shop.materials, shop.model, key, libraryMu));
    } catch (err) {
      if (!(err instanceof PredictionInputError)) throw err;
      grids.push(null);
      refused.add(c);
    }
    if (c % 16 === 15) yield;
  }
  const usable = rows.filter((r) => {
    if (!refused.has(r.cond)) return true;
    unpredictable++;
    return false;
  });
  const lotsWithParts = new Set(usable.map((r) => r.lot));
  if (lotsWithParts.size < 2) return null;

  const nRows = usable.length;
  const rowLot = Int32Array.from(usable, (r) => r.lot);
  const rowCond = Int32Array.from(usable, (r) => r.cond);
  const measured = Float64Array.from(usable, (r) => r.measured);
  const [xMin, xMax] = gridRange(grids.find((g) => g)!);
  const x0 = Math.log(libraryMu);

  /** Predictions (and slopes) of every condition at θ = (ln μ, ceiling). */
  const condF = new Float64Array(inputs.length), condDx = new Float64Array(inputs.length), condDc = new Float64Array(inputs.length);
  // forward differences: the model's slopes for the solver and the identifiability check
  const hx = 1e-4, hc = 1e-3;
  function evaluateConds(x: number, c: number, slopes: boolean, conds: Iterable<number>): void {
    for (const k of conds) {
      const g = grids[k]!;
      const r = responseAt(g, x);
      const f = responseDb(r, c);
      condF[k] = f;
      if (slopes) {
        condDx[k] = (responseDb(responseAt(g, x + hx), c) - f) / hx;
        condDc[k] = (responseDb(r, c + hc) - f) / hc;
      }
    }
  }

  /** Least squares over a subset of rows with weights, the free parameters of `mode`, from θ0. */
  function leastSquares(subset: Int32Array, weights: Float64Array, mode: FitMode, theta0: [number, number]): { theta: [number, number]; converged: boolean } {
    const free = FREE[mode];
    const dims = (free[0] ? 1 : 0) + (free[1] ? 1 : 0);
    // every part of one condition has the same prediction, so Σ w (y − f)² over its parts is
    // W·(ȳ − f)² plus a constant (W = Σ w, ȳ the weighted mean): the solver works on conditions
    const at = new Map<number, number>();
    const sumW: number[] = [], sumWy: number[] = [], conds: number[] = [];
    subset.forEach((row, i) => {
      const k = rowCond[row];
      let j = at.get(k);
      if (j === undefined) {
        at.set(k, (j = conds.push(k) - 1));
        sumW.push(0);
        sumWy.push(0);
      }
      sumW[j] += weights[i];
      sumWy[j] += weights[i] * measured[row];
    });
    const full = (t: Float64Array): [number, number] => {
      let k = 0;
      return [free[0] ? t[k++] : theta0[0], free[1] ? t[k++] : theta0[1]];
    };
    const model: LeastSquaresModel = {
      dims,
      evaluate(t, f, J) {
        const [x, c] = full(t);
        evaluateConds(x, c, !!J, conds);
        for (let j = 0; j < conds.length; j++) {
          const k = conds[j];
          f[j] = condF[k];
          if (J) {
            let d = 0;
            if (free[0]) J[j * dims + d++] = condDx[k];
            if (free[1]) J[j * dims + d++] = condDc[k];
          }
        }
      },
      clamp(t) {
        let k = 0;
        if (free[0]) {
          t[k] = Math.min(xMax, Math.max(xMin, t[k]));
          k++;
        }
        if (free[1]) t[k] = Math.min(CEILING_RANGE_DB[1], Math.max(CEILING_RANGE_DB[0], t[k]));
      },
    };
    const start = Float64Array.from([...(free[0] ? [theta0[0]] : []), ...(free[1] ? [theta0[1]] : [])]);
    const W = Float64Array.from(sumW);
    const y = Float64Array.from(sumWy, (v, j) => (W[j] > 0 ? v / W[j] : 0));
    const r = levenbergMarquardt(model, y, W, start);
    return { theta: full(r.theta), converged: r.converged };
  }

  const residualsAt = (theta: [number, number], subset: Int32Array): Float64Array => {
    evaluateConds(theta[0], theta[1], false, new Set(Array.from(subset, (i) => rowCond[i])));
    return Float64Array.from(subset, (i) => measured[i] - condF[rowCond[i]]);
  };

  /** 1/(parts of the lot in the subset): every lot counts once. */
  const lotWeights = (subset: Int32Array): Float64Array => {
    const count = new Map<number, number>();
    for (const i of subset) count.set(rowLot[i], (count.get(rowLot[i]) ?? 0) + 1);
    return Float64Array.from(subset, (i) => 1 / count.get(rowLot[i])!);
  };

  /** A start for the full fit: the weighted absolute error over the grid's μ and a ladder of ceilings. */
  function coarseStart(subset: Int32Array, mode: FitMode): [number, number] {
    const free = FREE[mode];
    const w = lotWeights(subset);
    const conds = [...new Set(Array.from(subset, (i) => rowCond[i]))];
    const xs = free[0] ? Array.from({ length: 9 }, (_, i) => xMin + ((xMax - xMin) * i) / 8) : [x0];
    const cs = free[1] ? Array.from({ length: 15 }, (_, i) => CEILING_RANGE_DB[0] + 10 * i).filter((c) => c <= CEILING_RANGE_DB[1]) : [libraryCeiling];
    let best: [number, number] = [x0, libraryCeiling];
    let bestCost = Infinity;
    const responses = conds.map((k) => ({ k, g: grids[k]! }));
    for (const x of xs) {
      const at = responses.map(({ k, g }) => ({ k, r: responseAt(g, x) }));
      for (const c of cs) {
        for (const { k, r } of at) condF[k] = responseDb(r, c);
        let cost = 0;
        for (let i = 0; i < subset.length; i++) cost += w[i] * Math.abs(measured[subset[i]] - condF[rowCond[subset[i]]]);
        if (cost < bestCost) {
          bestCost = cost;
          best = [x, c];
        }
      }
    }
    return best;
  }

  /** Parts and lots that read far from the rest (modified z-scores), given the residuals of `subset`. */
  function outliersOf(subset: Int32Array, r: Float64Array): RobustResult["leftOut"] {
    const byLot = new Map<number, number[]>();
    subset.forEach((row, i) => {
      const l = rowLot[row];
      if (!byLot.has(l)) byLot.set(l, []);
      byLot.get(l)!.push(i);
    });
    // parts against the rest of their lot (lots of three or more parts): each part against the
    // median of the others, on the within-lot σ from every pair of parts in a lot (the median
    // |difference| of two normal values is 0.6745·√2·σ), widened by the others' median's own
    // scatter, √(1 + π/(2(n − 1))), so that a lot of five flags no more than a lot of fifty
    const pairs: number[] = [];
    for (const idx of byLot.values()) {
      if (idx.length < 3) continue;
      for (let a = 0; a < idx.length; a++) for (let b = a + 1; b < idx.length && pairs.length < 200_000; b++) pairs.push(Math.abs(r[idx[a]] - r[idx[b]]));
    }
    const out: RobustResult["leftOut"] = [];
    const partOut = new Set<number>();
    if (pairs.length) {
      const sw = Math.max(MIN_SCALE_DB, median(pairs) / (Math.SQRT2 / MAD_TO_SIGMA));
      for (const idx of byLot.values()) {
        if (idx.length < 3) continue;
        const scale = sw * Math.sqrt(1 + Math.PI / (2 * (idx.length - 1)));
        const flagged = idx
          .map((i) => ({ i, d: r[i] - median(idx.filter((j) => j !== i).map((j) => r[j])) }))
          .filter((x) => Math.abs(x.d) > OUTLIER_Z * scale)
          .sort((a, b) => Math.abs(b.d) - Math.abs(a.d));
        for (const x of flagged.slice(0, Math.floor((idx.length - 1) / 2))) {
          partOut.add(x.i);
          out.push({ row: subset[x.i], deviation: x.d, z: Math.abs(x.d) / scale });
        }
      }
    }
    // lots against the other lots (five or more), at most a fifth of them
    if (byLot.size >= 5) {
      const lotLevel = [...byLot.entries()].map(([lot, idx]) => ({ lot, R: median(idx.filter((i) => !partOut.has(i)).map((i) => r[i])) }));
      const center = median(lotLevel.map((x) => x.R));
      const sb = Math.max(MIN_SCALE_DB, robustSigma(lotLevel.map((x) => x.R), center));
      const flagged = lotLevel.filter((x) => Math.abs(x.R - center) > OUTLIER_Z * sb).sort((a, b) => Math.abs(b.R - center) - Math.abs(a.R - center));
      for (const x of flagged.slice(0, Math.floor(byLot.size / 5))) out.push({ lot: x.lot, deviation: x.R - center, z: Math.abs(x.R - center) / sb });
    }
    return out;
  }

  /** Huber's loss to start, then trimming until the set left out settles. */
  function robustFit(subset: Int32Array, mode: FitMode, start: [number, number]): RobustResult {
    const w = lotWeights(subset);
    let theta = start;
    let converged = true;
    for (let round = 0; round < 4; round++) {
      const r = residualsAt(theta, subset);
      const s = Math.max(MIN_SCALE_DB, robustSigma(r, 0));
      const wh = Float64Array.from(w, (wi, i) => wi * Math.min(1, (HUBER_K * s) / Math.max(Math.abs(r[i]), 1e-12)));
      const next = leastSquares(subset, wh, mode, theta);
      const moved = Math.max(Math.abs(next.theta[0] - theta[0]), Math.abs(next.theta[1] - theta[1]) / 10);
      theta = next.theta;
      converged = next.converged;
      if (moved < 1e-5) break;
    }
    let leftOut: RobustResult["leftOut"] = [];
    let keyOf = "";
    let retainedRows = subset;
    for (let pass = 0; pass < 4; pass++) {
      const found = outliersOf(subset, residualsAt(theta, subset));
      const key = found.map((o) => (o.row !== undefined ? `r${o.row}` : `l${o.lot}`)).sort().join(",");
      if (pass > 0 && key === keyOf) break;
      leftOut = found;
      keyOf = key;
      const outRows = new Set(found.filter((o) => o.row !== undefined).map((o) => o.row!));
      const outLots = new Set(found.filter((o) => o.lot !== undefined).map((o) => o.lot!));
      retainedRows = subset.filter((i) => !outRows.has(i) && !outLots.has(rowLot[i]));
      if (!found.length && pass === 0) break;
      const next = leastSquares(retainedRows, lotWeights(retainedRows), mode, theta);
      theta = next.theta;
      converged = next.converged;
    }
    const retained = new Uint8Array(nRows);
    for (const i of retainedRows) retained[i] = 1;
    return { theta, retained, leftOut, converged };
  }

  const all = Int32Array.from({ length: nRows }, (_, i) => i);
  const start = coarseStart(all, "mu-and-ceiling");
  yield;
  let mode: FitMode = "mu-and-ceiling";
  let fit = robustFit(all, mode, start);
  yield;

  // identifiability, from the lots' slopes at the two-parameter fit
  const retainedIdx = all.filter((i) => fit.retained[i]);
  evaluateConds(fit.theta[0], fit.theta[1], true, new Set(Array.from(retainedIdx, (i) => rowCond[i])));
  const conditions = new Set(Array.from(retainedIdx, (i) => rowCond[i])).size;
  let ceilingLeverage = 0, muLeverage = 0;
  for (const i of retainedIdx) {
    ceilingLeverage = Math.max(ceilingLeverage, Math.abs(condDc[rowCond[i]]));
    muLeverage = Math.max(muLeverage, Math.abs(condDx[rowCond[i]]));
  }
  const info = lotInformation(retainedIdx, [true, true]);
  const rho = info ? -info[1] / Math.sqrt(info[0] * info[3]) : NaN;
  const atCeilingTop = fit.theta[1] >= CEILING_RANGE_DB[1] - 1e-6;
  let identifiability: string;
  const rhoText = Number.isFinite(rho) ? ` (correlation of the two estimates ${fmt(rho)})` : "";
  if (muLeverage < MU_LEVERAGE && ceilingLeverage >= CEILING_LEVERAGE) {
    mode = "ceiling-only";
    identifiability = "Every lot of this class sits at the construction ceiling, where μ moves nothing: only the ceiling is fitted, μ keeps the library's value.";
  } else if (conditions < 2) {
    mode = "mu-only";
    identifiability = "All lots of this class share one design, test frequency and direction, so the effective μ and the ceiling cannot be told apart: only μ is fitted, the ceiling keeps the shop's setting.";
  } else if (ceilingLeverage < CEILING_LEVERAGE || atCeilingTop) {
    mode = "mu-only";
    identifiability = "No lot of this class comes near the construction ceiling (their walls decide the figure): only μ is fitted, the ceiling keeps the shop's setting.";
  } else if (!(Math.abs(rho) <= IDENTIFIABLE_CORRELATION)) {
    mode = "mu-only";
    identifiability = `The lots' designs and frequencies move μ and the ceiling together${rhoText}: they cannot be told apart, so only μ is fitted and the ceiling keeps the shop's setting.`;
  } else {
    identifiability = `Lots of ${conditions} designs and test frequencies tell μ and the ceiling apart${rhoText}: both are fitted.`;
  }
  if (mode !== "mu-and-ceiling") {
    fit = robustFit(all, mode, mode === "mu-only" ? [fit.theta[0], libraryCeiling] : [x0, fit.theta[1]]);
    yield;
  }
  const free = FREE[mode];
  const edge = free[0] && (fit.theta[0] <= xMin + 1e-6 || fit.theta[0] >= xMax - 1e-6);
  const converged = fit.converged && !edge;

  // uncertainty from the scatter of the lots used
  const usedIdx = all.filter((i) => fit.retained[i]);
  const uncertainty = uncertaintyOf(usedIdx, fit.theta, free);

  // predictions: the library, the fit (both from the engine itself), and each lot from the fold that left it out
  const library = new Float64Array(nRows), fitted = new Float64Array(nRows), crossValidated = new Float64Array(nRows);
  const libraryByCond = new Map<number, number>();
  const exactAt = (k: number, theta: [number, number]) =>
    responseDb(exactResponse(inputs[k], shop.materials, shop.model, key, Math.exp(theta[0])), theta[1]);
  const fittedByCond = new Map<number, number>();
  for (let i = 0; i < nRows; i++) {
    const k = rowCond[i];
    if (!libraryByCond.has(k)) libraryByCond.set(k, responseDb(grids[k]!.atLibrary, libraryCeiling));
    if (!fittedByCond.has(k)) fittedByCond.set(k, exactAt(k, fit.theta));
    library[i] = libraryByCond.get(k)!;
    fitted[i] = fittedByCond.get(k)!;
  }
  yield;

  const lotsInClass = [...lotsWithParts].sort((a, b) => (lotIds[a] < lotIds[b] ? -1 : lotIds[a] > lotIds[b] ? 1 : 0));
  const folds = Math.min(shop.folds ?? CALIBRATION_DEFAULTS.folds, lotsInClass.length);
  const random = seededRandom(hashText(classKeyText(key)));
  for (let i = lotsInClass.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [lotsInClass[i], lotsInClass[j]] = [lotsInClass[j], lotsInClass[i]];
  }
  const foldOf = new Map(lotsInClass.map((lot, i) => [lot, i % folds]));
  for (let f = 0; f < folds; f++) {
    const training = all.filter((i) => foldOf.get(rowLot[i]) !== f);
    const held = all.filter((i) => foldOf.get(rowLot[i]) === f);
    const foldFit = robustFit(training, mode, fit.theta);
    const byCond = new Map<number, number>();
    for (const i of held) {
      const k = rowCond[i];
      if (!byCond.has(k)) byCond.set(k, exactAt(k, foldFit.theta));
      crossValidated[i] = byCond.get(k)!;
    }
    yield;
  }

  const errors = (pred: Float64Array) => medianAbs(Float64Array.from(measured, (m, i) => m - pred[i]));
  const error_db = { library: errors(library), fitted: errors(fitted), crossValidated: errors(crossValidated) };

  // the band: the cross-validated errors' median ± z·robust σ (90 % of lots)
  const cvResiduals = Float64Array.from(measured, (m, i) => m - crossValidated[i]);
  const center = median(cvResiduals);
  const sigma = Math.max(MIN_SCALE_DB, robustSigma(cvResiduals, center));
  const z = normalQuantile(0.5 + BAND_COVERAGE / 2);
  const usedLots = new Set(Array.from(usedIdx, (i) => rowLot[i]));
  const band_db = {
    below: Math.max(0, z * sigma - center),
    above: Math.max(0, z * sigma + center),
    basis: `the spread of this shop's measured lots of the class (${usedLots.size} lots, ${key.material} ${key.method}, ${key.construction}) against predictions made without them (${folds}-fold cross-validation): their median error ${fmt(center, 1)} dB ± ${fmt(z, 3)} robust σ (${fmt(sigma, 2)} dB), where ${Math.round(BAND_COVERAGE * 100)} % of lots fall [derived]`,
  };

  // outliers in words, with links' ids
  const lotOut = new Set<number>();
  const leftOut: LeftOut[] = fit.leftOut.map((o) => {
    if (o.lot !== undefined) {
      lotOut.add(o.lot);
      const lot = lots[o.lot];
      return {
        lotId: lot.lotId, lotNumber: lot.number, kind: "lot", deviation_db: o.deviation, z: o.z,
        reason: `Lot ${lot.number} reads ${fmt(o.deviation, 1)} dB from the class's other lots (modified z-score ${fmt(o.z, 1)}, over ${OUTLIER_Z}): a lot apart, such as a re-anneal or a furnace or material problem. Left out of the fit.`,
      };
    }
    const row = o.row!;
    const lot = lots[rowLot[row]];
    const serial = usable[row].serial;
    return {
      lotId: lot.lotId, lotNumber: lot.number, kind: "part", serial, deviation_db: o.deviation, z: o.z,
      reason: `Part ${serial} of lot ${lot.number} reads ${fmt(o.deviation, 1)} dB from the rest of its lot (modified z-score ${fmt(o.z, 1)}, over ${OUTLIER_Z}): a part knocked or mishandled after the anneal? Left out of the fit.`,
    };
  });
  const partsOutByLot = new Set(fit.leftOut.filter((o) => o.row !== undefined).map((o) => rowLot[o.row!]));

  const points: LotPoint[] = lotsInClass
    .slice()
    .sort((a, b) => a - b)
    .map((l) => {
      const idx = all.filter((i) => rowLot[i] === l);
      const avg = (xs: Float64Array) => mean(Array.from(idx, (i) => xs[i]));
      return {
        lotId: lots[l].lotId, number: lots[l].number, measured_db: avg(measured), library_db: avg(library), fitted_db: avg(fitted), crossValidated_db: avg(crossValidated),
        leftOut: lotOut.has(l) ? "lot" : partsOutByLot.has(l) ? "parts" : null,
      };
    });

  const mu_effective = Math.exp(fit.theta[0]);
  let inUse = false;
  let verdict: string;
  const errText = `in cross-validation the fit errs by ${fmt(error_db.crossValidated)} dB (median), the library's values by ${fmt(error_db.library)} dB`;
  if (usedLots.size < minLots) verdict = `${usedLots.size} lot${usedLots.size === 1 ? "" : "s"} of the ${minLots} a class needs: the library values stand.`;
  else if (!converged)
    verdict = edge
      ? `The fitted μ runs to the edge of the range searched (a tenth to ten times the library's ${Math.round(libraryMu)}): check the lots' records; the library values stand.`
      : "The fit did not settle: the library values stand.";
  else if (!(error_db.crossValidated < error_db.library)) verdict = `Not better than the library: ${errText}. The library values stand.`;
  else {
    inUse = true;
    verdict = `In use: ${errText}.`;
  }

  return {
    ...key,
    lots: usedLots.size,
    lotsMeasured: lotsWithParts.size,
    parts: nRows,
    lotsUsed: [...usedLots].sort((a, b) => a - b).map((l) => lots[l].lotId),
    leftOut,
    unpredictable,
    conditions,
    mode,
    identifiability,
    library: { mu_effective: libraryMu, ceiling_db: libraryCeiling },
    mu_effective,
    ceiling_db: fit.theta[1],
    uncertainty: {
      mu_effective: free[0] && uncertainty ? mu_effective * uncertainty.se[0] : null,
      ceiling_db: free[1] && uncertainty ? uncertainty.se[free[0] ? 1 : 0] : null,
      correlation: uncertainty?.correlation ?? null,
      basis: uncertainty
        ? `one standard uncertainty from the scatter of the ${usedLots.size} lots used about the fit (each lot once), through the slopes of the prediction [derived]`
        : "too few lots for an uncertainty",
    },
    error_db,
    folds,
    band_db,
    converged,
    inUse,
    verdict,
    points,
  };

  /** Σ over lots of the lot-mean slope's outer product (row-major 2×2 or 1×1), at the slopes last evaluated; null when singular. */
  function lotInformation(subset: Int32Array, which: Free): Float64Array | null {
    const dims = (which[0] ? 1 : 0) + (which[1] ? 1 : 0);
    const sums = new Map<number, { n: number; g: number[] }>();
    for (const i of subset) {
      const l = rowLot[i];
      let s = sums.get(l);
      if (!s) sums.set(l, (s = { n: 0, g: new Array(dims).fill(0) }));
      s.n++;
      let d = 0;
      if (which[0]) s.g[d++] += condDx[rowCond[i]];
      if (which[1]) s.g[d++] += condDc[rowCond[i]];
    }
    const M = new Float64Array(dims * dims);
    for (const s of sums.values())
      for (let a = 0; a < dims; a++) for (let b = 0; b < dims; b++) M[a * dims + b] += (s.g[a] / s.n) * (s.g[b] / s.n);
    const det = dims === 1 ? M[0] : M[0] * M[3] - M[1] * M[2];
    return det > 1e-12 ? M : null;
  }

  /** Standard errors of the free parameters from the lot-mean residuals (dof = lots − parameters). */
  function uncertaintyOf(subset: Int32Array, theta: [number, number], which: Free): { se: number[]; correlation: number | null } | null {
    evaluateConds(theta[0], theta[1], true, new Set(Array.from(subset, (i) => rowCond[i])));
    const M = lotInformation(subset, which);
    const dims = (which[0] ? 1 : 0) + (which[1] ? 1 : 0);
    const byLot = new Map<number, number[]>();
    for (const i of subset) {
      if (!byLot.has(rowLot[i])) byLot.set(rowLot[i], []);
      byLot.get(rowLot[i])!.push(measured[i] - condF[rowCond[i]]);
    }
    const dof = byLot.size - dims;
    if (!M || dof < 1) return null;
    let ss = 0;
    for (const r of byLot.values()) ss += mean(r) ** 2;
    const s2 = ss / dof;
    if (dims === 1) return { se: [Math.sqrt(s2 / M[0])], correlation: null };
    const det = M[0] * M[3] - M[1] * M[2];
    const c11 = (s2 * M[3]) / det, c22 = (s2 * M[0]) / det, c12 = (-s2 * M[1]) / det;
    return { se: [Math.sqrt(c11), Math.sqrt(c22)], correlation: c12 / Math.sqrt(c11 * c22) };
  }
}

/** Runs a class's fit to the end. */
export function fitClass(key: ClassKey, lots: MeasuredLot[], shop: FitShop): ClassFit | null {
  const steps = fitClassSteps(key, lots, shop);
  for (;;) {
    const s = steps.next();
    if (s.done) return s.value;
  }
}

/** What a prediction of the class says about the fit (the answer's `calibration`). */
export const calibrationNoteOf = (fit: Pick<ClassFit, "inUse" | "lots">, fittedAt: string): CalibrationNote => ({
  source: fit.inUse ? "shop" : "library",
  lots: fit.lots,
  fittedAt,
});
