import { readdirSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { QueryInterface, Sequelize } from "sequelize";
import { SequelizeStorage, Umzug } from "umzug";

const migrationsDir = path.join(path.dirname(fileURLToPath(import.meta.url)), "migrations");

export interface Migration {
  up(qi: QueryInterface, sequelize: Sequelize): Promise<void>;
  down(qi: QueryInterface, sequelize: Sequelize): Promise<void>;
}

/**
 * umzug over server/db/migrations/NNNN-*.ts, imported by our own code so it works under tsx and vitest;
 * the compiled server (build/server/db/migrations/*.js) keeps the same names.
 */
export function createMigrator(sequelize: Sequelize) {
  const files = readdirSync(migrationsDir).filter((f) => /^\d{4}-.+\.(ts|js)$/.test(f)).sort();
  return new Umzug({
    migrations: files.map((file) => ({
      name: file.replace(/\.(ts|js)$/, ""),
      async up() {
        const m: Migration = await import(path.join(migrationsDir, file));
        await m.up(sequelize.getQueryInterface(), sequelize);
      },
      async down() {
        const m: Migration = await import(path.join(migrationsDir, file));
        await m.down(sequelize.getQueryInterface(), sequelize);
      },
    })),
    storage: new SequelizeStorage({ sequelize, tableName: "schema_migrations" }),
    logger: undefined,
  });
}
