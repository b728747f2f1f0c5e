// Seeds the demo scenario once: `node --import tsx server/cli/seed.ts`.
import { loadConfig } from "../config";
import { seedDemo } from "../db/seed";
import { closeSequelize, getSequelize } from "../db/sequelize";

const config = loadConfig();
const { created } = await seedDemo(getSequelize(config.DATABASE_URL), { password: config.DEMO_PASSWORD, appUrl: config.appUrl });
console.log(created.length ? `demo data created: ${created.length} records` : "demo data already present");
await closeSequelize();
