import { materialLibrary, type MaterialProperties } from "../../shared/physics/materials";
import type { TaggedValue } from "../../shared/schemas/material";

// The materials table's rows: the engine's library (shared/physics/materials.ts) with a source
// tag on every value. ASTM A753 gives the nickel-iron alloys' types, densities and guaranteed
// minimum permeabilities, which are the library's design μ; saturation and resistivity are
// typical annealed ranges from practice or memory.

const a753 = (alloy: string) => `[pub] ASTM A753, ${alloy}`;
const range = (text: string) => `[practice]/[memory] typical annealed range ${text}; the mill certificate rules`;
const handbook = "[pub] handbook value";

export const materialSourceTags: Record<string, Record<TaggedValue, string>> = {
  ni80: {
    relativePermeability: `${a753("Alloy 4")} guaranteed minimum μ at 40 G (4 mT) 35 000 and maximum μ 175 000, used as the design values [memory: table row for heavy forms]; ${range("30 000–100 000 initial, 150 000–400 000 maximum")}`,
    saturation_T: range("0.74–0.80 T"),
    resistivity_ohm_m: range("0.55–0.60 µΩ·m"),
    density_kg_m3: a753("Alloy 4 (UNS N14080)"),
    muCurve: "[practice] shape of the annealed μ(B) curve, flat at the initial value through 10 mT",
    asFormedFactor: "[practice] forming lowers μ about tenfold until the final anneal",
  },
  ni50: {
    relativePermeability: `${a753("Alloy 2")} guaranteed minimum μ at 100 G (10 mT) 6 000 and maximum μ 50 000, used as the design values [memory: table row for heavy forms]; ${range("6 000–15 000 initial, 50 000–150 000 maximum")}`,
    saturation_T: range("1.50–1.60 T"),
    resistivity_ohm_m: range("0.45–0.48 µΩ·m"),
    density_kg_m3: a753("Alloy 2 (UNS K94840)"),
    muCurve: "[practice] shape of the annealed μ(B) curve, flat at the initial value through 10 mT",
    asFormedFactor: "[practice] forming lowers μ until the final anneal",
  },
  "steel-lc": {
    relativePermeability: "[practice]/[memory] conservative design values 250 initial, 2 000 maximum, from the typical ranges 200–500 and 1 000–5 000",
    saturation_T: "[practice]/[memory] typical 2.0–2.1 T",
    resistivity_ohm_m: "[practice]/[memory] typical 0.12–0.20 µΩ·m",
    density_kg_m3: "[practice]/[memory] 7.85 g/cm³",
    muCurve: "[practice] shape of the μ(B) curve, flat at the initial value through 10 mT",
    asFormedFactor: "[practice] cold work costs steel less μ than nickel-iron",
  },
  copper: {
    relativePermeability: "[pub] non-magnetic, μr = 1",
    saturation_T: "[pub] non-magnetic: no saturation",
    resistivity_ohm_m: handbook,
    density_kg_m3: handbook,
    muCurve: "[pub] non-magnetic, μr = 1",
    asFormedFactor: "[pub] non-magnetic: forming does not change μ",
  },
  aluminium: {
    relativePermeability: "[pub] non-magnetic, μr = 1",
    saturation_T: "[pub] non-magnetic: no saturation",
    resistivity_ohm_m: `${handbook} (pure; 6061 about 0.040 µΩ·m)`,
    density_kg_m3: handbook,
    muCurve: "[pub] non-magnetic, μr = 1",
    asFormedFactor: "[pub] non-magnetic: forming does not change μ",
  },
};

/** A library entry as a row of the materials table (database column names). */
export function materialRow(m: MaterialProperties, sourceTags: Record<string, string>) {
  return {
    id: m.id,
    name: m.name,
    mu_initial: m.relativePermeability.initial,
    mu_maximum: m.relativePermeability.maximum,
    saturation_t: m.saturation_T,
    resistivity_ohm_m: m.resistivity_ohm_m,
    density_kg_m3: m.density_kg_m3,
    mu_curve: JSON.stringify(m.muCurve),
    as_formed_factor: m.asFormedFactor,
    source: m.source,
    source_tags: JSON.stringify(sourceTags),
    active: true,
  };
}

export const materialSeedRows = () => materialLibrary.map((m) => materialRow(m, materialSourceTags[m.id] ?? {}));
