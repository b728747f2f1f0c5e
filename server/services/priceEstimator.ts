import {
  FabricationInputError, nestBlanks, partsForDesign, priceBuildUp,
  type DesignConfig, type FabricatedPart, type NestBlank, type PriceBuildUp,
} from "../../shared/fabrication";
import type { DesignConfiguration, NestingGroup, PriceEstimate } from "../../shared/schemas/price-estimate";
import type { PriceList } from "../../shared/schemas/pricing";
import { ValidationError } from "../errors";
import { materialResolver } from "./materialResolver";

/** Same sample size as the price build-up uses for its utilisation, so picture and price agree. */
const NEST_SAMPLE_BLANKS = 400;
const NEST_GAP_MM = 3;

const nestShape = (p: FabricatedPart, label: string): NestBlank =>
  p.blank.kind === "disc" ? { id: label, kind: "disc", diameter_mm: p.blank.diameter_mm } : { id: label, kind: "rectangle", length_mm: p.blank.length_mm, width_mm: p.blank.width_mm };

/**
 * The parts list of a configuration: every layer's blanks, with densities and forming limits
 * from the materials library and the given price list. Bad input is a 400 naming its field.
 */
export function designParts(c: DesignConfiguration, priceList: PriceList): FabricatedPart[] {
  const layers = c.layers.map((layer, i) => {
    const field = `configuration.layers.${i}.material`;
    const m = materialResolver({ id: layer.material, field, priceList });
    if (!priceList.materials.some((p) => p.materialId === m.id)) throw ValidationError({ [field]: `The current price list has no price for ${m.id}; choose another material or ask the shop.` });
    return { thickness_mm: layer.thickness_mm, gap_mm: layer.gap_mm, materialId: m.id, density_kg_m3: m.density_kg_m3, limits: m.formingLimits };
  });
  const design: DesignConfig = {
    shape: c.shape,
    method: c.method,
    dimensions_mm: c.dimensions_mm,
    layers,
    cornerRadius_mm: c.cornerRadius_mm,
    trim_mm: c.trim_mm,
    seamOverlap_mm: c.seamOverlap_mm,
    capFlange_mm: c.capFlange_mm,
    bendRadius_mm: c.bendRadius_mm,
    kFactor: c.kFactor,
    lid: c.lid,
    lidHeight_mm: c.lidHeight_mm,
    lidClearance_mm: c.lidClearance_mm,
    // a hole without a collar is cut in the blank, no part of its own
    holes: (c.holes ?? []).filter((h) => h.collarLength_mm > 0),
  };
  try {
    return partsForDesign(design);
  } catch (err) {
    if (err instanceof FabricationInputError) throw ValidationError({ [`configuration.${err.field}`]: err.message });
    throw err;
  }
}

/** The price build-up of a configuration at a quantity (no nesting picture: what a quote needs). */
export function designPrice(props: { configuration: DesignConfiguration; quantity: number; priceList: PriceList }): { parts: FabricatedPart[]; price: PriceBuildUp } {
  const parts = designParts(props.configuration, props.priceList);
  return { parts, price: priceBuildUp({ parts, quantity: props.quantity, priceList: props.priceList, nestGap_mm: NEST_GAP_MM }) };
}

/**
 * Parts, nesting on the stock sheets and the price build-up of a configuration at a quantity,
 * from the price list given (the current one for an estimate; a quote keeps its version).
 */
export function priceEstimator(props: { configuration: DesignConfiguration; quantity: number; priceList: PriceList }): PriceEstimate {
  const { configuration: c, quantity, priceList } = props;
  const parts = designParts(c, priceList);
  const price = priceBuildUp({ parts, quantity, priceList, nestGap_mm: NEST_GAP_MM });

  const nesting: NestingGroup[] = price.material.map((m) => {
    const group = parts.filter((p) => p.materialId === m.materialId && Math.abs(p.thickness_mm - m.thickness_mm) < 1e-6);
    const perAssembly = group.reduce((s, p) => s + p.quantityPerAssembly, 0);
    const assemblies = Math.max(1, Math.min(quantity, Math.floor(NEST_SAMPLE_BLANKS / perAssembly)));
    const base = { materialId: m.materialId, thickness_mm: m.thickness_mm, utilisation: m.utilisation, scrapFraction: 1 - m.utilisation, assembliesNested: assemblies };
    if (!m.sheet) return { ...base, sheet: null, partsPerSheet: 0, sheets: 0, sheetsEstimated: true, algorithm: null, placements: [] };
    const blanks: NestBlank[] = [];
    for (let a = 0; a < assemblies; a++) for (const p of group) for (let n = 0; n < p.quantityPerAssembly; n++) blanks.push(nestShape(p, `L${p.layer + 1} ${p.role}`));
    const r = nestBlanks(blanks, m.sheet, { gap_mm: NEST_GAP_MM });
    const scaled = assemblies < quantity;
    return {
      ...base,
      sheet: { width_mm: m.sheet.width_mm, length_mm: m.sheet.length_mm },
      partsPerSheet: r.partsPerSheet[0] ?? 0,
      sheets: scaled ? Math.ceil((r.sheetsNeeded * quantity) / assemblies) : r.sheetsNeeded,
      sheetsEstimated: scaled,
      algorithm: r.algorithm,
      placements: r.placements.filter((p) => p.sheet === 0).map((p) => ({ label: p.id ?? "", kind: p.kind, x: p.x, y: p.y, w: p.w, h: p.h, rotated: p.rotated })),
    };
  });

  return {
    parts: parts.map(({ density_kg_m3: _d, finishedPiece: _f, ...p }) => p),
    nesting,
    price,
    currency: price.currency,
  };
}
