// Material library: the rows the database is filled from. Permeabilities are DESIGN values: the
// standard's guaranteed minimum where ASTM A753 gives one, else a conservative typical figure
// (the low end of the ranges in domain.md §3). A prediction must be one the shop can stand
// behind; the mill certificate and the shop's own measured lots rule. Each μ(B) table is flat
// below its first point (the low-field range, where μ stays at its initial value) and rises
// only above it.

export interface MuPoint {
  /** operating flux density in the wall, tesla (peak) */
  B_T: number;
  /** annealed DC relative permeability at that induction */
  mu_r: number;
}

export interface MaterialProperties {
  id: string;
  name: string;
  relativePermeability: { initial: number; maximum: number };
  /** saturation induction; null for non-magnetic metals */
  saturation_T: number | null;
  resistivity_ohm_m: number;
  density_kg_m3: number;
  /** annealed DC μ(B): rises from initial to maximum, then collapses toward saturation */
  muCurve: MuPoint[];
  /** multiplier on μ for the as-formed (not yet annealed) state */
  asFormedFactor: number;
  source: string;
}

const a753 =
  "ASTM A753, Standard Specification for Wrought Nickel-Iron Soft Magnetic Alloys (alloy type, density, minimum DC properties) [pub]";

export const materialLibrary: MaterialProperties[] = [
  {
    id: "ni80",
    name: "80 % Ni-Fe-Mo, ASTM A753 Alloy 4 (UNS N14080)",
    relativePermeability: { initial: 35_000, maximum: 175_000 },
    saturation_T: 0.77,
    resistivity_ohm_m: 0.58e-6,
    density_kg_m3: 8740,
    // Flat at the guaranteed minimum μ at 40 G (4 mT) through 10 mT (A753's 100 G minimum is
    // higher still), rising to the guaranteed minimum maximum near 0.3 T, collapsing above ~0.6 T.
    muCurve: [
      { B_T: 0.01, mu_r: 35_000 },
      { B_T: 0.05, mu_r: 60_000 },
      { B_T: 0.1, mu_r: 90_000 },
      { B_T: 0.3, mu_r: 175_000 },
      { B_T: 0.5, mu_r: 130_000 },
      { B_T: 0.65, mu_r: 50_000 },
      { B_T: 0.77, mu_r: 5_000 },
    ],
    // Forming lowers μ by about an order of magnitude until the final hydrogen anneal [practice].
    asFormedFactor: 0.1,
    source: `${a753}: Alloy 4 minimum μ at 40 G (4 mT) 35 000 and minimum maximum μ 175 000 (heavy product forms; thin strip is guaranteed more) [pub]/[memory]. Typical annealed μ initial 30 000–100 000, μ max 150 000–400 000, saturation 0.74–0.80 T, resistivity 0.55–0.60 µΩ·m [practice]/[memory]; μ(B) curve shape [practice]; as-formed factor [practice].`,
  },
  {
    id: "ni50",
    name: "48–50 % Ni-Fe, ASTM A753 Alloy 2 (UNS K94840)",
    relativePermeability: { initial: 6_000, maximum: 50_000 },
    saturation_T: 1.55,
    resistivity_ohm_m: 0.465e-6,
    density_kg_m3: 8250,
    // Flat at the guaranteed minimum μ at 100 G (10 mT), rising to the guaranteed minimum maximum near 0.9 T.
    muCurve: [
      { B_T: 0.01, mu_r: 6_000 },
      { B_T: 0.1, mu_r: 15_000 },
      { B_T: 0.5, mu_r: 40_000 },
      { B_T: 0.9, mu_r: 50_000 },
      { B_T: 1.2, mu_r: 35_000 },
      { B_T: 1.4, mu_r: 12_000 },
      { B_T: 1.55, mu_r: 2_000 },
    ],
    asFormedFactor: 0.15,
    source: `${a753}: Alloy 2 minimum μ at 100 G (10 mT) 6 000 and minimum maximum μ 50 000 (heavy product forms) [pub]/[memory]. Typical annealed μ initial 6 000–15 000, μ max 50 000–150 000, saturation 1.50–1.60 T, resistivity 0.45–0.48 µΩ·m [practice]/[memory]; μ(B) curve shape [practice]; as-formed factor [practice].`,
  },
  {
    id: "steel-lc",
    name: "Cold-rolled low-carbon steel",
    relativePermeability: { initial: 250, maximum: 2_000 },
    saturation_T: 2.05,
    resistivity_ohm_m: 0.16e-6,
    density_kg_m3: 7850,
    muCurve: [
      { B_T: 0.01, mu_r: 250 },
      { B_T: 0.1, mu_r: 600 },
      { B_T: 0.5, mu_r: 1_800 },
      { B_T: 0.9, mu_r: 2_000 },
      { B_T: 1.3, mu_r: 1_500 },
      { B_T: 1.6, mu_r: 600 },
      { B_T: 1.9, mu_r: 150 },
      { B_T: 2.05, mu_r: 40 },
    ],
    // Cold work costs steel less than nickel-iron; it is usually not annealed for μ at all.
    asFormedFactor: 0.7,
    source:
      "Cold-rolled low-carbon steel, conservative typical values: μ initial 250 (range 200–500), μ max 2 000 (range 1 000–5 000), saturation 2.0–2.1 T, resistivity 0.12–0.20 µΩ·m, density 7.85 g/cm³ [practice]/[memory]; not covered by ASTM A753.",
  },
  {
    id: "copper",
    name: "Copper",
    relativePermeability: { initial: 1, maximum: 1 },
    saturation_T: null,
    resistivity_ohm_m: 1.68e-8,
    density_kg_m3: 8960,
    muCurve: [{ B_T: 1e-6, mu_r: 1 }, { B_T: 10, mu_r: 1 }],
    asFormedFactor: 1,
    source: "Copper: resistivity 0.0168 µΩ·m, density 8.96 g/cm³ (handbook values) [pub]; non-magnetic, shields by eddy currents only.",
  },
  {
    id: "aluminium",
    name: "Aluminium (pure; 6061 about 0.040 µΩ·m)",
    relativePermeability: { initial: 1, maximum: 1 },
    saturation_T: null,
    resistivity_ohm_m: 2.65e-8,
    density_kg_m3: 2700,
    muCurve: [{ B_T: 1e-6, mu_r: 1 }, { B_T: 10, mu_r: 1 }],
    asFormedFactor: 1,
    source: "Aluminium (pure): resistivity 0.0265 µΩ·m, density 2.70 g/cm³ (handbook values) [pub]; non-magnetic, shields by eddy currents only.",
  },
];

export function findMaterial(id: string, materials: MaterialProperties[] = materialLibrary): MaterialProperties | undefined {
  return materials.find((m) => m.id === id);
}
