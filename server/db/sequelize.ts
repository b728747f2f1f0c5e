import { Sequelize } from "sequelize";

let instance: Sequelize | undefined;

/** The one Sequelize instance of this process (models are bound to it in server/models). */
export function getSequelize(databaseUrl = process.env.DATABASE_URL ?? "postgres://postgres@127.0.0.1:54329/fluxwright"): Sequelize {
  if (!instance) {
    instance = new Sequelize(databaseUrl, {
      dialect: "postgres",
      logging: false,
      pool: { max: 10, min: 0, idle: 10_000, acquire: 10_000 },
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
