// Every class of the shop's measured lots fitted: parts are sorted into classes by their design
// (outermost alloy, forming method, construction); parts that no class takes (a layer given by
// its own μ outermost, a non-magnetic outer alloy, an unknown alloy) are counted and named.

import { classOf } from "../physics/build-model";
import { fitClassSteps, libraryMuOf, type ClassFit, type FitShop } from "./fit";
import { classKeyText, type ClassKey, type MeasuredLot } from "./types";

export interface Unclassified {
  lotId: string;
  lotNumber: string;
  parts: number;
  reason: string;
}

export interface Calibration {
  fits: ClassFit[];
  /** classes with a single measured lot: nothing to fit yet */
  waiting: (ClassKey & { lots: number })[];
  unclassified: Unclassified[];
}

/** The class's lots, each with only its parts of that class. */
export function lotsByClass(lots: MeasuredLot[], shop: Pick<FitShop, "materials">): { classes: Map<string, { key: ClassKey; lots: MeasuredLot[] }>; unclassified: Unclassified[] } {
  const classes = new Map<string, { key: ClassKey; lots: MeasuredLot[] }>();
  const unclassified: Unclassified[] = [];
  for (const lot of lots) {
    const parts = new Map<string, MeasuredLot["parts"]>();
    for (const part of lot.parts) {
      const c = classOf(part.design);
      let reason: string | null = null;
      if (!c.material) reason = "the outermost layer is given by its own μ, not an alloy of the library";
      else if (libraryMuOf(shop.materials, c.material) === null) reason = `${c.material} is not a magnetic alloy of the library: no μ to fit`;
      if (reason) {
        const last = unclassified.find((u) => u.lotId === lot.lotId && u.reason === reason);
        if (last) last.parts++;
        else unclassified.push({ lotId: lot.lotId, lotNumber: lot.number, parts: 1, reason });
        continue;
      }
      const key: ClassKey = { material: c.material!, method: c.method, construction: c.construction };
      const text = classKeyText(key);
      if (!classes.has(text)) classes.set(text, { key, lots: [] });
      if (!parts.has(text)) parts.set(text, []);
      parts.get(text)!.push(part);
    }
    for (const [text, ps] of parts) classes.get(text)!.lots.push({ ...lot, parts: ps });
  }
  return { classes, unclassified };
}

/** Fits every class, yielding between pieces of work (see fitClassSteps). */
export function* calibrateSteps(lots: MeasuredLot[], shop: FitShop): Generator<void, Calibration> {
  const { classes, unclassified } = lotsByClass(lots, shop);
  const fits: ClassFit[] = [];
  const waiting: Calibration["waiting"] = [];
  const ordered = [...classes.entries()].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  for (const [, { key, lots: classLots }] of ordered) {
    const fit = classLots.length >= 2 ? yield* fitClassSteps(key, classLots, shop) : null;
    if (fit) fits.push(fit);
    else waiting.push({ ...key, lots: classLots.length });
  }
  return { fits, waiting, unclassified };
}

export function calibrate(lots: MeasuredLot[], shop: FitShop): Calibration {
  const steps = calibrateSteps(lots, shop);
  for (;;) {
    const s = steps.next();
    if (s.done) return s.value;
  }
}
