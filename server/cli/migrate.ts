// Applies pending migrations: `node build/server/cli/migrate.js [down]` (compiled) or `npm run migrate`.
import { createMigrator } from "../db/migrator";
import { closeSequelize, getSequelize } from "../db/sequelize";

const migrator = createMigrator(getSequelize());
const done = process.argv[2] === "down" ? await migrator.down() : await migrator.up();
console.log(done.length ? `migrations applied: ${done.map((m) => m.name).join(", ")}` : "database schema is up to date");
await closeSequelize();
