import { buildModelFrom, type BuildModel } from "../../shared/physics/build-model";
import { constructionSettingsOf } from "../../shared/schemas/pricing";
import { PriceListVersion } from "../models";
import { processCache } from "./processCache";

// The as-built model the predictions use: the construction settings of the current shop-rates
// version (the defaults from practice before any is saved), held in this process like the
// materials, so a prediction costs no database query. A save of the settings invalidates it.

const cache = processCache<BuildModel>(async () => {
  const current = await PriceListVersion.current();
  return buildModelFrom(constructionSettingsOf(current?.data ?? {}));
});

export const buildModelCatalog = (): Promise<BuildModel> | BuildModel => cache.get();
export const invalidateBuildModel = (): void => cache.invalidate();
