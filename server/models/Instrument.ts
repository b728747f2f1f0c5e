import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { InstrumentKind, InstrumentStatus } from "../../shared/schemas/instrument";
import type { StoredFile } from "./StoredFile";

/** A test instrument of the register, with its current calibration (the history is InstrumentCalibration). */
export class Instrument extends Model<InferAttributes<Instrument>, InferCreationAttributes<Instrument>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare kind: InstrumentKind;
  declare serialNumber: string | null;
  declare make: string | null;
  declare range: string | null;
  declare turns: number | null;
  declare area_mm2: number | null;
  declare radius_mm: number | null;
  declare notes: string | null;
  declare status: CreationOptional<InstrumentStatus>;
  /** YYYY-MM-DD */
  declare calibrationDue: string;
  declare lastCalibratedOn: string | null;
  declare calibrationSentOn: CreationOptional<string | null>;
  declare calibrationLaboratory: CreationOptional<string | null>;
  declare currentCertificateId: CreationOptional<string | null>;
  declare reminderSentFor: CreationOptional<string | null>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare currentCertificate?: NonAttribute<StoredFile | null>;

  static initModel(sequelize: Sequelize) {
    Instrument.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.STRING(120), allowNull: false },
        kind: { type: DataTypes.STRING(30), allowNull: false },
        serialNumber: { type: DataTypes.STRING(80), allowNull: true },
        make: { type: DataTypes.STRING(160), allowNull: true },
        range: { type: DataTypes.STRING(160), allowNull: true },
        turns: { type: DataTypes.INTEGER, allowNull: true },
        area_mm2: { type: DataTypes.DOUBLE, allowNull: true, field: "area_mm2" },
        radius_mm: { type: DataTypes.DOUBLE, allowNull: true, field: "radius_mm" },
        notes: { type: DataTypes.TEXT, allowNull: true },
        status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: "in-service" },
        calibrationDue: { type: DataTypes.DATEONLY, allowNull: false },
        lastCalibratedOn: { type: DataTypes.DATEONLY, allowNull: true },
        calibrationSentOn: { type: DataTypes.DATEONLY, allowNull: true },
        calibrationLaboratory: { type: DataTypes.STRING(160), allowNull: true },
        currentCertificateId: { type: DataTypes.UUID, allowNull: true },
        reminderSentFor: { type: DataTypes.DATEONLY, allowNull: true },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "instruments", modelName: "Instrument" },
    );
  }
}
