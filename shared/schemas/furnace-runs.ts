/** Furnaces and anneal windows (shop settings), and furnace runs: the load of lots and the run's record. */
import { z } from "zod";
import type { AnnealWindow, Furnace } from "../shop-floor/anneal";
import type { StoredFileJson } from "./files";
import { listQuerySchema, type PersonRef } from "./list";

// --- settings schemas (the planner edits them with the shop settings) ---

const range = (what: string, min: number, max: number) =>
  z
    .object({
      min: z.number({ error: `${what}: give the lowest value` }).min(min).max(max),
      max: z.number({ error: `${what}: give the highest value` }).min(min).max(max),
    })
    .refine((r) => r.min <= r.max, { error: "the lowest value must not exceed the highest", path: ["max"] });

export const annealWindowSchema = z.object({
  materialId: z.string({ error: "choose the alloy" }).trim().min(1, { error: "choose the alloy" }).max(40),
  peak_c: range("Peak temperature", 200, 1400),
  soak_min: range("Time at temperature", 1, 2880),
  dewPointMax_c: z.number({ error: "give the driest dew point allowed, in °C" }).min(-100).max(20),
  coolingRate_c_per_h: range("Cooling rate", 1, 5000),
  source: z.string().trim().max(500).default(""),
});

export const furnaceSchema = z.object({
  id: z.string({ error: "give the furnace a short code" }).trim().regex(/^[A-Z0-9-]{1,20}$/, { error: "use capital letters, digits and hyphens (up to 20)" }),
  name: z.string({ error: "name the furnace" }).trim().min(1, { error: "name the furnace" }).max(100),
  maxLoad_kg: z.number({ error: "give the heaviest load in kg" }).positive({ error: "the load must be more than 0 kg" }).max(100_000),
});

export const furnacesSchema = z
  .array(furnaceSchema)
  .min(1, { error: "keep at least one furnace" })
  .max(20)
  .refine((list) => new Set(list.map((f) => f.id)).size === list.length, { error: "each furnace needs its own code" });

export const annealWindowsSchema = z
  .array(annealWindowSchema)
  .max(40)
  .refine((list) => new Set(list.map((w) => w.materialId)).size === list.length, { error: "one window per alloy" });

const temperature = (what: string) => z.number({ error: `Give the ${what} in °C.` }).min(-100, { error: `The ${what} must be at least -100 °C.` }).max(1500, { error: `The ${what} must be at most 1500 °C.` });
const dewPoint = (what: string) => z.number({ error: `Give the ${what} in °C.` }).min(-100, { error: `The ${what} must be at least -100 °C.` }).max(30, { error: `The ${what} must be at most 30 °C.` });

export const furnaceRunCreateSchema = z.object({
  lotIds: z
    .array(z.uuid({ error: "each entry must be a lot's id" }), { error: "lotIds must be a list of lot ids" })
    .min(1, { error: "Choose the lots in the load." })
    .max(50, { error: "A load takes at most 50 lots." })
    .refine((ids) => new Set(ids).size === ids.length, { error: "A lot is listed twice." }),
  /** measured peak temperature */
  peakTemperature_c: temperature("measured peak temperature"),
  /** time at temperature */
  soak_min: z.number({ error: "Give the time at temperature in minutes." }).positive({ error: "The time at temperature must be more than 0 minutes." }).max(2880, { error: "The time at temperature must be at most 48 h." }),
  /** dew point of the hydrogen going in */
  dewPoint_c: dewPoint("dew point in"),
  /** dew point at the outlet */
  dewPointOut_c: dewPoint("dew point out").optional(),
  coolingRate_c_per_h: z.number({ error: "Give the cooling rate in °C/h." }).positive({ error: "The cooling rate must be more than 0 °C/h." }).max(5000, { error: "The cooling rate must be at most 5000 °C/h." }),
  /** a furnace of the shop settings (default: the first) */
  furnaceId: z.string({ error: "Choose the furnace." }).trim().min(1).max(20).optional(),
  setpoint_c: temperature("setpoint").optional(),
  /** when the run ended (default now) */
  ranAt: z.iso.datetime({ offset: true, error: "ranAt must be an ISO date-time" }).optional(),
  notes: z.string({ error: "Notes must be text." }).trim().max(2000).optional(),
});
export type FurnaceRunCreateInput = z.input<typeof furnaceRunCreateSchema>;

export const furnaceRunListQuerySchema = listQuerySchema(["createdAt", "number"] as const, "createdAt").extend({
  withinWindow: z.enum(["true", "false"], { error: 'withinWindow must be "true" or "false"' }).optional(),
});
export type FurnaceRunListQuery = z.input<typeof furnaceRunListQuerySchema>;

/** GET /api/furnaces: what the furnace page needs to plan a load. */
export interface FurnacesJson {
  furnaces: Furnace[];
  annealWindows: AnnealWindow[];
  caution: string;
}

export interface FurnaceRunJson {
  id: string;
  number: string;
  furnace: Furnace;
  material: { id: string; name: string };
  lots: Array<{ id: string; number: string; pieces: number; mass_kg: number; onHold: boolean }>;
  pieces: number;
  load_kg: number;
  setpoint_c: number | null;
  peakTemperature_c: number;
  soak_min: number;
  dewPoint_c: number;
  dewPointOut_c: number | null;
  coolingRate_c_per_h: number;
  /** the window the record was checked against, as it was then */
  window: AnnealWindow;
  withinWindow: boolean;
  deviations: string[];
  chart: StoredFileJson | null;
  operator: PersonRef | null;
  notes: string | null;
  ranAt: string;
  createdAt: string;
  abilities: { attachChart: boolean };
}

export interface FurnaceRunSummaryJson {
  id: string;
  number: string;
  furnaceName: string;
  materialId: string;
  lotNumbers: string[];
  pieces: number;
  load_kg: number;
  peakTemperature_c: number;
  withinWindow: boolean;
  chart: boolean;
  ranAt: string;
}
