import { Router, type Request } from "express";
import { logFrequencies, predictShield, PredictionInputError, sweepAttenuation } from "../../shared/physics";
import { predictionRequestSchema, sweepOptionsSchema, SWEEP_FROM_HZ, SWEEP_TO_HZ, type PredictionRequest } from "../../shared/schemas/prediction";
import type { AppDeps } from "../deps";
import { ValidationError } from "../errors";
import { parseInput } from "../middleware/validate";
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
// visitors on one default), and a prediction is a pure function of the body and the library:
// answers are kept per catalog (an edit makes a new catalog, so they go with it), a few hundred at most.
const MEMO_SIZE = 500;
/** a design is a few hundred bytes; anything much longer is not worth keeping */
const MEMO_MAX_KEY = 4096;
const memos = new WeakMap<MaterialCatalog, Map<string, string>>();

function memoFor(catalog: MaterialCatalog): Map<string, string> {
  let memo = memos.get(catalog);
  if (!memo) memos.set(catalog, (memo = new Map()));
  return memo;
}

function remember(memo: Map<string, string>, key: string, json: string): void {
  if (memo.size >= MEMO_SIZE) memo.delete(memo.keys().next().value!); // oldest first
  memo.set(key, json);
}

async function parsed(req: Request): Promise<{ request: PredictionRequest; catalog: MaterialCatalog }> {
  const request = parseInput(predictionRequestSchema, req.body);
  return { request, catalog: await materialCatalog() };
}

/** The shielding prediction: a public computation, nothing stored, no database query per request. */
export function predictionsRouter({ publicLimit }: AppDeps): Router {
  const router = Router();

  router.post("/predictions", publicLimit, async (req, res) => {
    const catalog = await materialCatalog();
    const memo = memoFor(catalog);
    const key = JSON.stringify(req.body);
    let json = memo.get(key);
    if (json === undefined) {
      const request = parseInput(predictionRequestSchema, req.body);
      json = JSON.stringify(engine(() => predictShield(request, (id) => catalog.byId.get(id))));
      if (key.length <= MEMO_MAX_KEY) remember(memo, key, json);
    }
    res.type("application/json").send(json);
  });

  // The attenuation-against-frequency curve for the page's chart, 1 Hz to 10 kHz on a log scale.
  router.post("/predictions/sweep", publicLimit, async (req, res) => {
    const { request, catalog } = await parsed(req);
    const { points } = parseInput(sweepOptionsSchema, req.body);
    const lookup = (id: string) => catalog.byId.get(id);
    res.json(engine(() => sweepAttenuation(request, lookup, logFrequencies(SWEEP_FROM_HZ, SWEEP_TO_HZ, points))));
  });

  return router;
}
