/**
 * How a paid order becomes lots and jobs. One job per part of the design (each layer's can, wall,
 * body or lid, its end caps and collars) for the ordered quantity; a lot is the pieces of one alloy
 * that go through one furnace run together. When an alloy's pieces for the whole order are heavier
 * than the largest furnace takes, the assemblies are shared out over several lots of nearly equal
 * size, each with its own jobs.
 */
import type { FabricatedPart } from "../fabrication";
import { planRouting, type RoutingStep } from "./routing";

export interface PlannedJob {
  /** index into the parts list */
  part: number;
  /** pieces: assemblies in the lot × pieces per assembly */
  quantity: number;
  routing: RoutingStep[];
  /** index (in this lot's jobs) of the piece an end cap or collar is welded to */
  assembly: number | null;
}

export interface PlannedLot {
  materialId: string;
  assemblies: number;
  /** finished pieces (what the furnace run and the sampling plan count) */
  pieces: number;
  mass_kg: number;
  annealed: boolean;
  jobs: PlannedJob[];
}

export class ReleasePlanError extends Error {
  constructor(readonly code: string, message: string) {
    super(message);
    this.name = "ReleasePlanError";
  }
}

/** n items shared out over k groups of nearly equal size (the larger ones first). */
export function shareOut(n: number, k: number): number[] {
  const base = Math.floor(n / k);
  return Array.from({ length: k }, (_, i) => base + (i < n % k ? 1 : 0));
}

export function planRelease(props: {
  parts: FabricatedPart[];
  quantity: number;
  /** a magnetic alloy gets the final hydrogen anneal */
  annealed: (materialId: string) => boolean;
  /** the heaviest load any furnace of the shop takes, kg */
  maxLoad_kg: number;
}): PlannedLot[] {
  const { parts, quantity } = props;
  const alloys = [...new Set(parts.map((p) => p.materialId ?? ""))];
  const lots: PlannedLot[] = [];
  for (const materialId of alloys) {
    const indices = parts.map((p, i) => (p.materialId ?? "") === materialId ? i : -1).filter((i) => i >= 0);
    const annealed = props.annealed(materialId);
    const massPerAssembly = indices.reduce((s, i) => s + (parts[i].mass_kg ?? 0) * parts[i].quantityPerAssembly, 0);
    let perLot = quantity;
    if (annealed && massPerAssembly > 0) {
      if (massPerAssembly > props.maxLoad_kg) {
        throw new ReleasePlanError(
          "TOO_HEAVY_FOR_FURNACES",
          `One assembly's ${materialId} parts weigh ${massPerAssembly.toFixed(1)} kg, more than the largest furnace takes (${props.maxLoad_kg} kg): add a furnace or raise its load in the shop settings.`,
        );
      }
      perLot = Math.max(1, Math.floor(props.maxLoad_kg / massPerAssembly));
    }
    const count = Math.ceil(quantity / perLot);
    for (const assemblies of shareOut(quantity, count)) {
      const jobs: PlannedJob[] = [];
      const pieceIndex = new Map<number, number>(); // layer → job index of its finished piece that takes components
      for (const i of indices) {
        const p = parts[i];
        const takesComponents = p.finishedPiece && p.role !== "lid" && parts.some((c) => !c.finishedPiece && c.layer === p.layer);
        if (takesComponents && !pieceIndex.has(p.layer)) pieceIndex.set(p.layer, jobs.length);
        jobs.push({
          part: i,
          quantity: assemblies * p.quantityPerAssembly,
          routing: planRouting({ role: p.role, method: p.method, finishedPiece: p.finishedPiece, drawStages: p.drawStages, processAnneals: p.processAnneals, takesComponents, annealed }),
          assembly: null,
        });
      }
      for (const job of jobs) if (!parts[job.part].finishedPiece) job.assembly = pieceIndex.get(parts[job.part].layer) ?? null;
      lots.push({
        materialId,
        assemblies,
        pieces: jobs.reduce((s, j) => s + (parts[j.part].finishedPiece ? j.quantity : 0), 0),
        mass_kg: assemblies * massPerAssembly,
        annealed,
        jobs,
      });
    }
  }
  return lots;
}
