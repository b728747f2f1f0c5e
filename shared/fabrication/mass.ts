/** Mass of a flat blank: area × thickness × density (kg/m³). 1 mm³ = 1e-9 m³. */
export function blankMass_kg(area_mm2: number, thickness_mm: number, density_kg_m3: number): number {
  return area_mm2 * thickness_mm * density_kg_m3 * 1e-9;
}
