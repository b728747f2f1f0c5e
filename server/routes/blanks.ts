import { Router } from "express";
import { computeBlank, FabricationInputError, flatPatternDxf, flatPatternFilename, partNoteLines, shopLimitWarnings, suggestKFactor, type BlankResult } from "../../shared/fabrication";
import { blankRequestSchema, type BlankJson, type BlankRequest } from "../../shared/schemas/blank";
import type { AppDeps } from "../deps";
import { ValidationError } from "../errors";
import { parseInput } from "../middleware/validate";
import { materialCatalog } from "../services/materialCatalog";
import { materialResolver, type ResolvedMaterial } from "../services/materialResolver";
import { shopRatesCatalog } from "../services/shopRatesCatalog";

/** Flat blanks and their DXF: public computations, nothing stored. */
export function blanksRouter({ publicLimit }: AppDeps): Router {
  const router = Router();

  async function compute(body: unknown): Promise<{ request: BlankRequest; result: BlankResult; material?: ResolvedMaterial }> {
    const request = parseInput(blankRequestSchema, body);
    // the shop's current list, held in the process: forming limits for a draw, stock sheets for every part
    const list = await shopRatesCatalog();
    let material: ResolvedMaterial | undefined;
    if (request.material) material = materialResolver({ id: request.material, field: "material", priceList: list, materials: (await materialCatalog()).list });
    let result: BlankResult;
    try {
      result = computeBlank(request, material);
    } catch (err) {
      if (err instanceof FabricationInputError) throw ValidationError({ [err.field]: err.message });
      throw err;
    }
    const limits = shopLimitWarnings({
      result,
      thickness_mm: request.thickness_mm,
      materialId: material?.id ?? null,
      stockSheets: list?.stockSheets ?? [],
      bendRadius_mm: request.method === "bent" ? request.bendRadius_mm : undefined,
    });
    return { request, result: { ...result, warnings: [...result.warnings, ...limits] }, material };
  }

  router.post("/blanks", publicLimit, async (req, res) => {
    const { request, result, material } = await compute(req.body);
    const answer: BlankJson = {
      ...result,
      ...(material ? { material: { id: material.id, name: material.name, density_kg_m3: material.density_kg_m3 } } : {}),
      ...(request.method === "bent" ? { suggestedKFactor: suggestKFactor(request.bendRadius_mm, request.thickness_mm) } : {}),
    };
    res.json(answer);
  });

  router.post("/blanks/dxf", publicLimit, async (req, res) => {
    const { request, result, material } = await compute(req.body);
    // attachment() sets a type from the extension (image/vnd.dxf); the contract says application/dxf
    res.attachment(flatPatternFilename(request)).type("application/dxf").send(flatPatternDxf(result.geometry, partNoteLines(request, material?.name)));
  });

  return router;
}
