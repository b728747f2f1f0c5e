import { CONSTRUCTION_WORDS, METHOD_WORDS, type BuildMethod, type Construction } from "../../../shared/physics/build-model";
import { RUN_RULES, type RunRuleId } from "../../../shared/calibration/control-chart";

export const ALLOY_WORDS: Record<string, string> = {
  ni80: "80 % nickel-iron (ASTM A753 Alloy 4)",
  ni50: "50 % nickel-iron (ASTM A753 Alloy 2)",
  "steel-lc": "low-carbon steel",
};

export const alloyWords = (id: string) => ALLOY_WORDS[id] ?? id;
export const classWords = (c: { material: string; method: BuildMethod; construction?: Construction }) =>
  `${alloyWords(c.material)}, ${METHOD_WORDS[c.method]}${c.construction ? `, ${CONSTRUCTION_WORDS[c.construction]}` : ""}`;
export const ruleName = (id: RunRuleId) => RUN_RULES[id].name;

/** dB with one decimal and its sign when asked. */
export const db = (x: number, signed = false) => `${signed && x > 0 ? "+" : ""}${x.toFixed(1)} dB`;
export const grouped = (x: number, digits = 3) => Number(x.toPrecision(digits)).toLocaleString("en-GB").replace(/,/g, " ");
export const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" }) + " UTC";
export const day = (iso: string) => new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", timeZone: "UTC" });
