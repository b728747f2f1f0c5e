/**
 * Hydrogen anneal: the shop's furnaces and each alloy's anneal window, and the check of a furnace
 * run's record against the window. A record outside the window puts its lots on hold.
 */

export interface Range {
  min: number;
  max: number;
}

/** The final anneal's limits for one alloy, as the shop sets them. */
export interface AnnealWindow {
  materialId: string;
  /** measured peak temperature, °C */
  peak_c: Range;
  /** time at temperature, minutes */
  soak_min: Range;
  /** the wettest dew point allowed at the gas inlet and outlet, °C */
  dewPointMax_c: number;
  /** controlled cooling rate through roughly 600–300 °C, °C/h */
  coolingRate_c_per_h: Range;
  /** where the figures come from, with their tags */
  source: string;
}

export interface Furnace {
  id: string;
  name: string;
  /** the heaviest load it takes, parts and fixtures, kg */
  maxLoad_kg: number;
}

/**
 * Seeded from domain.md section 5 [practice]: 80 % Ni-Fe-Mo about 1100–1180 °C for 2–4 h in dry
 * hydrogen (dew point −40 °C or drier), then about 100–300 °C/h through 600–300 °C; 50 % Ni-Fe
 * is similar and less sensitive to cooling rate (the wider 50–500 °C/h here is [memory]). Confirm
 * with the alloy producer's data and ASTM A753's appendix; the planner edits them in the shop settings.
 */
export const defaultAnnealWindows: AnnealWindow[] = [
  {
    materialId: "ni80",
    peak_c: { min: 1100, max: 1180 },
    soak_min: { min: 120, max: 240 },
    dewPointMax_c: -40,
    coolingRate_c_per_h: { min: 100, max: 300 },
    source: "Typical final anneal of 80 % Ni-Fe-Mo [practice]; confirm with the producer's data and ASTM A753",
  },
  {
    materialId: "ni50",
    peak_c: { min: 1100, max: 1180 },
    soak_min: { min: 120, max: 240 },
    dewPointMax_c: -40,
    coolingRate_c_per_h: { min: 50, max: 500 },
    source: "As 80 % Ni-Fe [practice]; the wider cooling range reflects its lower sensitivity [memory]; confirm with the producer's data",
  },
];

/** One furnace until the planner enters the shop's own (an invented placeholder, not a recommendation). */
export const defaultFurnaces: Furnace[] = [{ id: "H2-1", name: "Hydrogen furnace 1", maxLoad_kg: 250 }];

/** What a furnace run's record holds that the window judges. */
export interface AnnealRecord {
  peakTemperature_c: number;
  soak_min: number;
  dewPoint_c: number;
  dewPointOut_c?: number | null;
  coolingRate_c_per_h: number;
}

export interface AnnealDeviation {
  field: keyof AnnealRecord;
  message: string;
}

const fmt = (x: number) => String(+x.toFixed(1));

/** Every way the record falls outside the window, in words (empty when inside). */
export function annealDeviations(record: AnnealRecord, w: AnnealWindow): AnnealDeviation[] {
  const out: AnnealDeviation[] = [];
  const range = (field: keyof AnnealRecord, value: number, r: Range, what: string, unit: string) => {
    if (value < r.min) out.push({ field, message: `${what} ${fmt(value)} ${unit} is below the window's ${fmt(r.min)} ${unit}` });
    else if (value > r.max) out.push({ field, message: `${what} ${fmt(value)} ${unit} is above the window's ${fmt(r.max)} ${unit}` });
  };
  range("peakTemperature_c", record.peakTemperature_c, w.peak_c, "Peak temperature", "°C");
  range("soak_min", record.soak_min, w.soak_min, "Time at temperature", "min");
  if (record.dewPoint_c > w.dewPointMax_c) out.push({ field: "dewPoint_c", message: `Dew point in ${fmt(record.dewPoint_c)} °C is wetter than the window's ${fmt(w.dewPointMax_c)} °C` });
  if (record.dewPointOut_c != null && record.dewPointOut_c > w.dewPointMax_c) {
    out.push({ field: "dewPointOut_c", message: `Dew point out ${fmt(record.dewPointOut_c)} °C is wetter than the window's ${fmt(w.dewPointMax_c)} °C` });
  }
  range("coolingRate_c_per_h", record.coolingRate_c_per_h, w.coolingRate_c_per_h, "Cooling rate", "°C/h");
  return out;
}

/** The cautions shown wherever the hydrogen furnace is run or scanned (domain.md section 7) [pub]. */
export const HYDROGEN_CAUTION =
  "Hydrogen furnace: hydrogen burns in air from about 4 % to 75 % with an almost invisible flame, and furnace gases are asphyxiants. " +
  "Follow NFPA 86 (or the local equivalent, such as EN 746-3 in Europe) and the site's procedures: purge before heating and after cooling, " +
  "keep the interlocks and flame safeguards in service, and let only trained staff load, run and unload the furnace.";

/** The same, short enough for a traveler's step. */
export const HYDROGEN_CAUTION_SHORT =
  "Hydrogen: follow NFPA 86 (or EN 746-3 / the local code) and site procedures; purge and interlocks in service; trained staff only. H2 burns at 4–75 % in air with an almost invisible flame.";

/** After the final anneal the permeability is easily lost again [practice]. */
export const AFTER_ANNEAL_CAUTION =
  "Annealed parts: handle padded, no bending, knocks, drops, drilling or press fits from here on; stress undoes the anneal. Demagnetize before test.";
