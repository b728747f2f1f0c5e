import pg from "pg";
import type { Logger } from "pino";
import type { Sequelize } from "sequelize";
import { invalidateBuildModel } from "./buildModelCatalog";
import { invalidateMaterialCatalog } from "./materialCatalog";
import { invalidateShopRatesCatalog } from "./shopRatesCatalog";
import { invalidateVerifications } from "./verificationCache";

// The reference data each process holds (materials, shop rates, the as-built model with the
// calibration fits, the public check's answers) is invalidated in every process of the shop's database when one of them
// changes it: at once here, and through PostgreSQL's NOTIFY in the others. A calibration refit
// run by another process's job worker then reaches this process's next prediction.

export type ReferenceData = "materials" | "shop-rates" | "build-model" | "certificates";

const CHANNEL = "fluxwright_reference_data";

const invalidators: Record<ReferenceData, () => void> = {
  materials: invalidateMaterialCatalog,
  "shop-rates": invalidateShopRatesCatalog,
  "build-model": invalidateBuildModel,
  certificates: invalidateVerifications,
};

const isReferenceData = (s: string): s is ReferenceData => Object.hasOwn(invalidators, s);

/** After the edit's transaction has committed: drops this process's copy and tells the others. */
export async function referenceDataChanged(sequelize: Sequelize, ...what: ReferenceData[]): Promise<void> {
  for (const w of what) invalidators[w]();
  for (const w of what) await sequelize.query("select pg_notify($1, $2)", { bind: [CHANNEL, w] });
}

/**
 * Listens for the other processes' changes on one connection of its own. A lost connection is
 * retried; everything is invalidated when it is back, since a change may have gone unheard.
 */
export function listenForReferenceChanges({ databaseUrl, logger }: { databaseUrl: string; logger: Logger }): { close(): Promise<void> } {
  let client: pg.Client | null = null;
  let closed = false;
  let retry: NodeJS.Timeout | null = null;

  const connect = async (again: boolean): Promise<void> => {
    const c = new pg.Client({ connectionString: databaseUrl, application_name: "fluxwright reference-data listener" });
    c.on("notification", (n) => {
      if (n.channel === CHANNEL && n.payload && isReferenceData(n.payload)) invalidators[n.payload]();
    });
    c.on("error", (err) => {
      logger.warn({ err }, "reference-data listener lost its connection");
      void c.end().catch(() => {});
      schedule();
    });
    try {
      await c.connect();
      if (closed) return void (await c.end());
      await c.query(`listen ${CHANNEL}`);
      client = c;
      if (again) for (const invalidate of Object.values(invalidators)) invalidate();
    } catch (err) {
      logger.warn({ err }, "reference-data listener could not connect; retrying");
      void c.end().catch(() => {});
      schedule();
    }
  };
  const schedule = () => {
    client = null;
    if (closed || retry) return;
    retry = setTimeout(() => {
      retry = null;
      void connect(true);
    }, 2_000);
    retry.unref();
  };

  void connect(false);
  return {
    async close() {
      closed = true;
      if (retry) clearTimeout(retry);
      const c = client;
      client = null;
      await c?.end().catch(() => {});
    },
  };
}
