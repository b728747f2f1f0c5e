import type { PriceList } from "../../shared/schemas/pricing";
import { PriceListVersion } from "../models";
import { processCache } from "./processCache";

// The current shop-rates document (stock sheets, forming limits, prices) held in this process,
// so a public blank computation can check its part against the stock sheets without a database
// query. A save invalidates it at once in every process (referenceData.ts).

const cache = processCache<PriceList | null>(async () => (await PriceListVersion.current())?.data ?? null);

export const shopRatesCatalog = (): Promise<PriceList | null> | PriceList | null => cache.get();
export const invalidateShopRatesCatalog = (): void => cache.invalidate();
