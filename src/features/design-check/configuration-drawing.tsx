import type { ReactNode } from "react";
import { useQuery } from "@tanstack/react-query";
import { predictionRequestSchema } from "../../../shared/schemas/prediction";
import { materialsQueryOptions } from "../../api/materials";
import { CrossSection } from "./cross-section";

/** A stored configuration (a quote's, a saved design's) drawn in section; the fallback when it is not one the engine takes. */
export function ConfigurationDrawing({ configuration, fallback = null }: { configuration: unknown; fallback?: ReactNode }) {
  const materials = useQuery(materialsQueryOptions);
  const parsed = predictionRequestSchema.safeParse(configuration);
  if (!parsed.success) return fallback;
  return <CrossSection request={parsed.data} materials={materials.data ?? []} />;
}
