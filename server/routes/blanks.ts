import { Router } from "express";
import { computeBlank, FabricationInputError, flatPatternDxf, flatPatternFilename, suggestKFactor, type BlankResult } from "../../shared/fabrication";
import { blankRequestSchema, type BlankJson, type BlankRequest } from "../../shared/schemas/blank";
import type { AppDeps } from "../deps";
import { ValidationError } from "../errors";
import { parseInput } from "../middleware/validate";
import { PriceListVersion } from "../models";
import { materialCatalog } from "../services/materialCatalog";
import { materialResolver, type ResolvedMaterial } from "../services/materialResolver";

/** Flat blanks and their DXF: public computations, nothing stored. */
export function blanksRouter({ publicLimit }: AppDeps): Router {
  const router = Router();

  async function compute(body: unknown): Promise<{ request: BlankRequest; result: BlankResult; material?: ResolvedMaterial }> {
    const request = parseInput(blankRequestSchema, body);
    let material: ResolvedMaterial | undefined;
    if (request.material) {
      // forming limits only matter for a draw; the other methods need no database round trip
      const list = request.method === "drawn" ? ((await PriceListVersion.current())?.data ?? null) : null;
      material = materialResolver({ id: request.material, field: "material", priceList: list, materials: (await materialCatalog()).list });
    }
    try {
      return { request, result: computeBlank(request, material), material };
    } catch (err) {
      if (err instanceof FabricationInputError) throw ValidationError({ [err.field]: err.message });
      throw err;
    }
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
    const { request, result } = await compute(req.body);
    // attachment() sets a type from the extension (image/vnd.dxf); the contract says application/dxf
    res.attachment(flatPatternFilename(request)).type("application/dxf").send(flatPatternDxf(result.geometry));
  });

  return router;
}
