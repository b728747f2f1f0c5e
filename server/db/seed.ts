import type { Sequelize } from "sequelize";
import type { Role } from "../../shared/schemas/auth";
import { hashPassword } from "../auth/passwords";
import type { Transaction } from "sequelize";
import { defaultPriceList } from "../../shared/fabrication";
import { priceListSchema } from "../../shared/schemas/pricing";
import { Material, Organization, PriceListVersion, ShopSettings, User, initModels, recordEvent } from "../models";
import { materialSeedRows } from "./material-rows";
import { loadConfig } from "../config";
import { createFileStore, type FileStore } from "../files/store";
import { seedOrdering } from "./seed-ordering";
import { seedShopFloor } from "./seed-shop-floor";
import { seedInstruments } from "./seed-quality";
import { seedMeasuredLots } from "./seed-calibration";
import { seedQualityRecords } from "./seed-quality-records";

// The demo scenario: an invented shield shop and two invented customer organisations.
// Any resemblance to a real company is accidental.
export const DEMO = {
  shop: "Wrenfield Shield Works (demo)",
  customers: ["Fernhollow Instruments (demo)", "Quillbrook Beam Lab (demo)"],
  users: [
    { email: "customer@demo.test", name: "Ilse Marwick", role: "customer", org: 0 },
    { email: "customer2@demo.test", name: "Teodor Vance", role: "customer", org: 1 },
    { email: "operator@demo.test", name: "Rui Okafor", role: "operator", org: "shop" },
    { email: "qa@demo.test", name: "Mina Sølvberg", role: "qa", org: "shop" },
    { email: "admin@demo.test", name: "Cas Lindqvist", role: "admin", org: "shop" },
  ] as { email: string; name: string; role: Role; org: number | "shop" }[],
};

/** Idempotent: creates what is missing and leaves what exists (a changed demo password is kept). */
export const DEMO_SHOP_DETAILS = {
  name: "Wrenfield Shield Works (demo)",
  address: "Unit 4, Kiln Lane\nWrenfield Trading Estate\nWF3 9QA",
  email: "orders@wrenfield.example",
  phone: "+44 1632 960 123",
  mailFrom: "Wrenfield Shield Works (demo) <orders@wrenfield.example>",
};

export async function seedDemo(sequelize: Sequelize, opts: { password: string; appUrl?: string; store?: FileStore }): Promise<{ created: string[] }> {
  initModels(sequelize);
  const created: string[] = [];
  const measuredLots: string[] = [];
  await sequelize.transaction(async (transaction) => {
    // one seed at a time (two test runners or a start and a test may seed the same database)
    await sequelize.query(`select pg_advisory_xact_lock(hashtext('fluxwright-demo-seed'))`, { transaction });
    const [shop, shopNew] = await Organization.findOrCreate({ where: { name: DEMO.shop }, defaults: { name: DEMO.shop, kind: "shop" }, transaction });
    if (shopNew) created.push(shop.name);
    const customers: Organization[] = [];
    for (const name of DEMO.customers) {
      const [org, isNew] = await Organization.findOrCreate({ where: { name }, defaults: { name, kind: "customer" }, transaction });
      if (isNew) created.push(name);
      customers.push(org);
    }
    const passwordHash = await hashPassword(opts.password);
    for (const u of DEMO.users) {
      const organizationId = u.org === "shop" ? shop.id : customers[u.org].id;
      const [user, isNew] = await User.findOrCreate({
        where: { email: u.email },
        defaults: { email: u.email, name: u.name, role: u.role, organizationId, passwordHash },
        transaction,
      });
      if (isNew) {
        created.push(u.email);
        await recordEvent({ actor: null, organizationId, action: "user.seeded", subject: { type: "user", id: user.id } }, transaction);
      }
    }
    if (await seedShopRates(transaction)) created.push("price list version 1");
    const materials = await seedMaterials(transaction);
    if (materials.length) created.push(`materials ${materials.join(", ")}`);
    // the shop's own details, while they are still the migration's placeholder
    const shopSettings = await ShopSettings.current(transaction);
    if (shopSettings.name === "Fluxwright shield shop") {
      await shopSettings.update(DEMO_SHOP_DETAILS, { transaction });
      created.push("shop details");
    }
    const users = await User.findAll({ where: { email: DEMO.users.map((u) => u.email) }, transaction });
    const byEmail = (email: string) => users.find((u) => u.email === email)!;
    created.push(
      ...(await seedOrdering({
        customers,
        buyers: [byEmail("customer@demo.test"), byEmail("customer2@demo.test")],
        planner: byEmail("admin@demo.test"),
        appUrl: opts.appUrl ?? "http://127.0.0.1:4100",
        transaction,
      })),
    );
    created.push(
      ...(await seedShopFloor({
        sequelize,
        customers,
        buyers: [byEmail("customer@demo.test"), byEmail("customer2@demo.test")],
        operator: byEmail("operator@demo.test"),
        planner: byEmail("admin@demo.test"),
        // mill certificates and furnace charts are files, like uploads
        store: opts.store ?? createFileStore(loadConfig().UPLOAD_DIR),
        appUrl: opts.appUrl ?? "http://127.0.0.1:4100",
        transaction,
      })),
    );
    created.push(...(await seedInstruments({ qa: byEmail("qa@demo.test"), transaction })));
    measuredLots.push(...(await seedMeasuredLots({ sequelize, transaction })));
    created.push(...(await seedQualityRecords({ sequelize, qa: byEmail("qa@demo.test"), appUrl: opts.appUrl ?? "http://127.0.0.1:4100", transaction })));
  });
  created.push(...measuredLots);
  return { created };
}

/**
 * Version 1 of the shop rates: the engine's demo price list, stock sheets and forming limits
 * (invented demo values, not quotations). Only when no version exists; safe to race
 * (ON CONFLICT DO NOTHING on the version), so parallel test files may all call it.
 */
export async function seedShopRates(transaction?: Transaction): Promise<boolean> {
  if (await PriceListVersion.count({ transaction })) return false;
  await PriceListVersion.bulkCreate(
    [{ version: 1, part: "seed", data: priceListSchema.parse(defaultPriceList), createdById: null }],
    { transaction, ignoreDuplicates: true },
  );
  return true;
}

/**
 * The materials library from the engine's list with its source tags: adds the ids that are
 * missing and leaves edited rows alone. Safe to race (ON CONFLICT DO NOTHING), so test files may call it.
 */
export async function seedMaterials(transaction?: Transaction): Promise<string[]> {
  const have = new Set((await Material.findAll({ attributes: ["id"], transaction })).map((m) => m.id));
  const missing = materialSeedRows().filter((r) => !have.has(r.id));
  if (!missing.length) return [];
  await Material.bulkCreate(
    missing.map((r) => ({
      id: r.id, name: r.name, muInitial: r.mu_initial, muMaximum: r.mu_maximum, saturationT: r.saturation_t,
      resistivityOhmM: r.resistivity_ohm_m, densityKgM3: r.density_kg_m3, muCurve: JSON.parse(r.mu_curve),
      asFormedFactor: r.as_formed_factor, source: r.source, sourceTags: JSON.parse(r.source_tags), active: true,
    })),
    { transaction, ignoreDuplicates: true },
  );
  return missing.map((r) => r.id);
}
