import { Router, type Request } from "express";
import type { BuildModel } from "../../shared/physics/build-model";
import { logFrequencies, predictShield, PredictionInputError, sweepAttenuation } from "../../shared/physics";
import { predictionRequestSchema, sweepOptionsSchema, type PredictionRequest } from "../../shared/schemas/prediction";
import type { AppDeps } from "../deps";
import { ValidationError } from "../errors";
import { parseInput } from "../middleware/validate";
import { buildModelCatalog } from "../services/buildModelCatalog";
import { materialCatalog, type MaterialCatalog } from "../services/materialCatalog";

/** An engine input error (unknown material, impossible geometry) is a 400 naming its field. */
function engine<T>(run: () => T): T {
  try {
    return run();
  } catch (err) {
    if (err instanceof PredictionInputError) throw ValidationError({ [err.field]: err.message });
    throw err;
  }
}

// The page asks for the same design again and again (typing back, comparing variants, several
// visitors on one default), and a prediction is a pure function of the body, the library and
// the shop's construction settings: answers are kept per catalog and settings (an edit makes a
// new one of either, so they go with it), a few hundred at most.
const MEMO_SIZE = 500;
/** a design is a few hundred bytes; anything much longer is not worth keeping */
const MEMO_MAX_KEY = 4096;
const memos = new WeakMap<MaterialCatalog, WeakMap<BuildModel, Map<string, string>>>();

function memoFor(catalog: MaterialCatalog, build: BuildModel): Map<string, string> {
  let byBuild = memos.get(catalog);
  if (!byBuild) memos.set(catalog, (byBuild = new WeakMap()));
  let memo = byBuild.get(build);
  if (!memo) byBuild.set(build, (memo = new Map()));
  return memo;
}

function remember(memo: Map<string, string>, key: string, json: string): void {
  if (memo.size >= MEMO_SIZE) memo.delete(memo.keys().next().value!); // oldest first
  memo.set(key, json);
}

/** The reference data a prediction reads, from this process (no database query once loaded). */
async function context(): Promise<{ catalog: MaterialCatalog; build: BuildModel }> {
  const [catalog, build] = await Promise.all([materialCatalog(), buildModelCatalog()]);
  return { catalog, build };
}

/** The shielding prediction: a public computation, nothing stored, no database query per request. */
export function predictionsRouter({ publicLimit }: AppDeps): Router {
  const router = Router();

  router.post("/predictions", publicLimit, async (req, res) => {
    const { catalog, build } = await context();
    const memo = memoFor(catalog, build);
    const key = JSON.stringify(req.body);
    let json = memo.get(key);
    if (json === undefined) {
      const request: PredictionRequest = parseInput(predictionRequestSchema, req.body);
      json = JSON.stringify(engine(() => predictShield(request, (id) => catalog.byId.get(id), build)));
      if (key.length <= MEMO_MAX_KEY) remember(memo, key, json);
    }
    res.type("application/json").send(json);
  });

  // Both figures against frequency for the page's chart, log-spaced over the asked range
  // (1 Hz to 10 kHz unless the body says `from_hz` and `to_hz`).
  router.post("/predictions/sweep", publicLimit, async (req: Request, res) => {
    const request = parseInput(predictionRequestSchema, req.body);
    const { points, from_hz, to_hz } = parseInput(sweepOptionsSchema, req.body);
    const { catalog, build } = await context();
    const lookup = (id: string) => catalog.byId.get(id);
    res.json(engine(() => sweepAttenuation(request, lookup, logFrequencies(from_hz, to_hz, points), build)));
  });

  return router;
}
