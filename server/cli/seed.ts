// Seeds the demo scenario once: `node build/server/cli/seed.js` (compiled) or `npm run seed`.
import { loadConfig } from "../config";
import { seedDemo } from "../db/seed";
import { closeSequelize, getSequelize } from "../db/sequelize";
import { createFileStore } from "../files/store";

const config = loadConfig();
const { created } = await seedDemo(getSequelize(config.DATABASE_URL), { password: config.DEMO_PASSWORD, appUrl: config.appUrl, store: createFileStore(config.UPLOAD_DIR) });
console.log(created.length ? `demo data created: ${created.length} records` : "demo data already present (seed skipped)");
await closeSequelize();
