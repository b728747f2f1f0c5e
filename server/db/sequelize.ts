import { availableParallelism } from "node:os";
import { Sequelize } from "sequelize";

let instance: Sequelize | undefined;

/**
 * Connections for this process: its share, among the server's worker processes, of twice the cores
 * and one, the PostgreSQL wiki's rule of thumb for a pool ("connection count = core count × 2 +
 * effective spindle count"). More backends than that only take turns on the same cores: on two
 * cores, ten connections gave about a seventh fewer scans per second than four or six under the
 * scan bench's ten stations. DB_POOL_MAX overrides it.
 */
export const defaultPoolMax = (workers = 1, cores = availableParallelism()) => Math.max(2, Math.ceil((cores * 2 + 1) / workers));

/** The one Sequelize instance of this process (models are bound to it in server/models). */
export function getSequelize(databaseUrl = process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:54329/fluxwright", poolMax = defaultPoolMax()): Sequelize {
  if (!instance) {
    instance = new Sequelize(databaseUrl, {
      dialect: "postgres",
      logging: false,
      pool: { max: poolMax, min: 0, idle: 10_000, acquire: 10_000 },
      define: { underscored: true },
    });
  }
  return instance;
}

export async function closeSequelize(): Promise<void> {
  if (instance) {
    await instance.close();
    instance = undefined;
  }
}
