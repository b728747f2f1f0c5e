/** Material heats: the receiving record of a delivery of sheet, its mill certificate, and the jobs cut from it. */
import { z } from "zod";
import type { StoredFileJson } from "./files";
import { listQuerySchema, type PersonRef } from "./list";

export const heatUnits = ["sheets", "kg"] as const;

export const heatCreateSchema = z.object({
  heatNumber: z
    .string({ error: "Give the heat number from the mill certificate." })
    .trim()
    .min(1, { error: "Give the heat number from the mill certificate." })
    .max(40, { error: "Keep the heat number under 40 characters." }),
  materialId: z.string({ error: "Choose the alloy." }).trim().min(1, { error: "Choose the alloy." }).max(40),
  thickness_mm: z.number({ error: "Give the gauge in mm." }).positive({ error: "The gauge must be more than 0 mm." }).max(50, { error: "The gauge must be at most 50 mm." }),
  supplier: z.string({ error: "Name the supplier." }).trim().min(1, { error: "Name the supplier." }).max(200),
  quantity: z.number({ error: "Give the quantity received." }).positive({ error: "The quantity must be more than 0." }).max(1_000_000),
  unit: z.enum(heatUnits, { error: 'unit is "sheets" or "kg"' }).default("sheets"),
  /** the day the delivery arrived (default today) */
  receivedOn: z.iso.date({ error: "Give the day received as YYYY-MM-DD." }).optional(),
  notes: z.string({ error: "Notes must be text." }).trim().max(2000).optional(),
});
export type HeatCreateInput = z.input<typeof heatCreateSchema>;

export const heatListQuerySchema = listQuerySchema(["receivedOn", "heatNumber", "createdAt"] as const, "receivedOn").extend({
  materialId: z.string().trim().max(40).optional(),
  thickness_mm: z.coerce.number({ error: "thickness_mm must be a number" }).positive({ error: "thickness_mm must be more than 0" }).optional(),
});
export type HeatListQuery = z.input<typeof heatListQuerySchema>;

export const MAX_CERTIFICATE_BYTES = 20 * 1024 * 1024;

export interface HeatJson {
  id: string;
  heatNumber: string;
  materialId: string;
  materialName: string;
  thickness_mm: number;
  supplier: string;
  quantity: number;
  unit: (typeof heatUnits)[number];
  receivedOn: string;
  receivedBy: PersonRef | null;
  notes: string | null;
  millCertificate: StoredFileJson | null;
  /** jobs whose material was issued from this heat */
  jobCount: number;
  createdAt: string;
  abilities: { attach: boolean };
}
