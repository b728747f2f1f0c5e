/** GET /api/floor: the floor board — work in progress by step, late jobs, lots waiting for a furnace load, holds. */
import type { StepKey } from "../shop-floor/routing";
import type { PersonRef } from "./list";

export const FLOOR_LIST_LIMIT = 50;

export interface FloorBoardJson {
  generatedAt: string;
  /** open jobs at each step of the routing order: not yet started there, and started */
  wip: Array<{ step: StepKey; label: string; waiting: number; started: number }>;
  openJobs: number;
  /** open jobs past their due date, most overdue first (at most FLOOR_LIST_LIMIT; `count` is all of them) */
  late: {
    count: number;
    jobs: Array<{ id: string; code: string; lotId: string; lotNumber: string; orderNumber: string; step: StepKey | null; dueDate: string; daysLate: number }>;
  };
  /** lots whose jobs have all been cleaned, not yet in a furnace run */
  waitingForFurnace: Array<{ id: string; number: string; materialId: string; pieces: number; mass_kg: number; dueDate: string }>;
  holds: Array<{ lotId: string; lotNumber: string; orderNumber: string; reason: string; heldAt: string; heldBy: PersonRef | null; furnaceRunId: string | null }>;
}
