import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { RoutingUpdateInput } from "../../shared/schemas/jobs";
import { routingProblems, type RoutingStep } from "../../shared/shop-floor/routing";
import { ConflictError, ValidationError } from "../errors";
import { recordEvent, type Job } from "../models";
import type { Actor } from "../policies/utils";
import { materialCatalog } from "./materialCatalog";

/**
 * The planner changes a job's routing (locked by the caller) before work starts on it: which steps,
 * the draw stages and process anneals of the form step, a note per step for the traveler. The
 * trade's order and the final anneal of a magnetic piece are kept (400 naming the step otherwise).
 */
export async function routingEditor(props: { actor: Actor; job: Job; input: RoutingUpdateInput; sequelize: Sequelize; ip: string | null; transaction: Transaction }): Promise<Job> {
  const { actor, job, transaction } = props;
  const [scanned] = await props.sequelize.query<{ n: number }>(`select count(*)::int as n from scans where job_id = $1`, { bind: [job.id], type: QueryTypes.SELECT, transaction });
  if (job.stepIndex > 0 || job.stepStartedAt || scanned.n > 0) {
    throw ConflictError("ROUTING_LOCKED", `Work has started on job ${job.code}: its routing can no longer change.`);
  }
  const catalog = await materialCatalog();
  const annealed = (catalog.byId.get(job.materialId)?.relativePermeability.maximum ?? 1) > 1.5;
  const steps: RoutingStep[] = props.input.steps.map((s) => ({
    key: s.key,
    ...(s.drawStages !== undefined ? { drawStages: s.drawStages } : {}),
    ...(s.processAnneals !== undefined ? { processAnneals: s.processAnneals } : {}),
    ...(s.note ? { note: s.note } : {}),
  }));
  const problems = routingProblems(steps, { method: job.method, finishedPiece: job.finishedPiece, annealed, role: job.role });
  if (Object.keys(problems).length) throw ValidationError(problems, "This routing cannot be used.");
  const before = job.routing;
  const anneal = steps.findIndex((s) => s.key === "anneal");
  job.routing = steps;
  job.currentStep = steps[0].key;
  job.annealIndex = anneal < 0 ? null : anneal;
  job.drawStages = steps.find((s) => s.key === "form")?.drawStages ?? job.drawStages;
  job.processAnneals = steps.find((s) => s.key === "form")?.processAnneals ?? job.processAnneals;
  await job.save({ transaction });
  await recordEvent({ actor, action: "job.routing-changed", subject: { type: "job", id: job.id }, data: { code: job.code, before, after: steps }, ip: props.ip }, transaction);
  return job;
}
