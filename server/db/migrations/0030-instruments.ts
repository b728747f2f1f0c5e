import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";

// The register of test instruments (probes, search coils, Helmholtz sets, signal sources) and the
// record of each calibration with its certificate (a stored_files row). Calibration records are
// kept as they were: a new calibration is a new row.
export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  const now = sequelize.literal("now()");
  await qi.createTable("instruments", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: sequelize.literal("gen_random_uuid()") },
    name: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.STRING(30), allowNull: false },
    serial_number: { type: DataTypes.STRING(80), allowNull: true },
    make: { type: DataTypes.STRING(160), allowNull: true },
    range: { type: DataTypes.STRING(160), allowNull: true },
    turns: { type: DataTypes.INTEGER, allowNull: true },
    area_mm2: { type: DataTypes.DOUBLE, allowNull: true },
    radius_mm: { type: DataTypes.DOUBLE, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: "in-service" },
    calibration_due: { type: DataTypes.DATEONLY, allowNull: false },
    last_calibrated_on: { type: DataTypes.DATEONLY, allowNull: true },
    calibration_sent_on: { type: DataTypes.DATEONLY, allowNull: true },
    calibration_laboratory: { type: DataTypes.STRING(160), allowNull: true },
    current_certificate_id: { type: DataTypes.UUID, allowNull: true, references: { model: "stored_files", key: "id" } },
    /** the due date the 14-day reminder was mailed for: one reminder per instrument per due date */
    reminder_sent_for: { type: DataTypes.DATEONLY, allowNull: true },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await sequelize.query(`
    alter table instruments
      add constraint instruments_kind check (kind in ('fluxgate-probe','gaussmeter-probe','search-coil','helmholtz-coil','signal-source')),
      add constraint instruments_status check (status in ('in-service','in-calibration')),
      add constraint instruments_figures check (
        (turns is null or turns > 0) and (area_mm2 is null or area_mm2 > 0) and (radius_mm is null or radius_mm > 0)
        and (kind <> 'search-coil' or (turns is not null and area_mm2 is not null))
        and (kind <> 'helmholtz-coil' or (turns is not null and radius_mm is not null)));`);
  await qi.addIndex("instruments", ["calibration_due"]);
  await sequelize.query(`create unique index instruments_name_unique on instruments (lower(name))`);

  await qi.createTable("instrument_calibrations", {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: sequelize.literal("gen_random_uuid()") },
    instrument_id: { type: DataTypes.UUID, allowNull: false, references: { model: "instruments", key: "id" }, onDelete: "CASCADE" },
    calibrated_on: { type: DataTypes.DATEONLY, allowNull: false },
    calibration_due: { type: DataTypes.DATEONLY, allowNull: false },
    laboratory: { type: DataTypes.STRING(160), allowNull: true },
    certificate_number: { type: DataTypes.STRING(80), allowNull: true },
    stored_file_id: { type: DataTypes.UUID, allowNull: true, unique: true, references: { model: "stored_files", key: "id" } },
    recorded_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  });
  await sequelize.query(`alter table instrument_calibrations add constraint instrument_calibrations_dates check (calibration_due > calibrated_on)`);
  await qi.addIndex("instrument_calibrations", ["instrument_id", "calibrated_on"]);
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable("instrument_calibrations");
  await qi.dropTable("instruments");
}
