import { Router } from "express";
import { scanRequestSchema, type ScanJson } from "../../shared/schemas/scans";
import type { AppDeps } from "../deps";
import { ValidationError } from "../errors";
import { parseInput } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { scanRoles } from "../policies/shop-floor";
import { requireRole } from "../policies/utils";
import { presentJob, presentScanEvent } from "../presenters/jobs";
import { stepScanner } from "../services/stepScanner";
import { materialNames } from "./jobs";

/**
 * POST /api/scans: 201 for a new event, 200 for one already recorded (an exact repeat: the same
 * idempotency key, or a step start or completion that is already there), 409 out of sequence,
 * 404 for a code no job has.
 */
export function scansRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  router.post("/scans", requireUser, async (req, res) => {
    const actor = req.user!;
    requireRole(actor, ...scanRoles);
    const header = req.get("idempotency-key");
    const body = (req.body ?? {}) as Record<string, unknown>;
    if (header !== undefined && body.idempotencyKey !== undefined && header !== body.idempotencyKey) {
      throw ValidationError({ idempotencyKey: "the Idempotency-Key header and the body name different keys" });
    }
    const input = parseInput(scanRequestSchema, header !== undefined ? { ...body, idempotencyKey: header } : body);
    // one statement records the event and moves the job (its own transaction): see stepScanner
    const outcome = await stepScanner({ actor, input, sequelize });
    const answer: ScanJson = { repeat: outcome.repeat, event: presentScanEvent(outcome.scan, outcome.code), job: presentJob(outcome.job, actor, await materialNames()) };
    res.status(outcome.repeat ? 200 : 201).json(answer);
  });

  return router;
}
