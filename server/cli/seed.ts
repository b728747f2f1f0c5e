// Seeds the demo scenario once: `node build/server/cli/seed.js` (compiled) or `npm run seed`.
import { loadConfig } from "../config";
import { seedDemo } from "../db/seed";
import { closeSequelize, getSequelize } from "../db/sequelize";
import { createFileStore } from "../files/store";
import { firstCalibration } from "../services/calibrationRefitter";
import { createMeasuredLotsReader } from "../services/measuredLotsReader";

const config = loadConfig();
const sequelize = getSequelize(config.DATABASE_URL);
const { created } = await seedDemo(sequelize, { password: config.DEMO_PASSWORD, appUrl: config.appUrl, store: createFileStore(config.UPLOAD_DIR) });
console.log(created.length ? `demo data created: ${created.length} records` : "demo data already present (seed skipped)");
// the first calibration of the measured lots, so the calibration page shows fits on a fresh start
if (await firstCalibration({ sequelize, readLots: createMeasuredLotsReader(sequelize) })) console.log("first calibration fitted");
await closeSequelize();
