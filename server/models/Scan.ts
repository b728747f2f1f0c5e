import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ScanData } from "../../shared/schemas/scans";
import type { ScanAction, StepKey } from "../../shared/shop-floor/routing";

/** A step's start or completion on a job, as the station recorded it (append-only). */
export class Scan extends Model<InferAttributes<Scan>, InferCreationAttributes<Scan>> {
  declare id: CreationOptional<string>;
  declare jobId: string;
  declare stepIndex: number;
  declare step: StepKey;
  declare action: ScanAction;
  declare station: string;
  declare operatorId: string | null;
  declare idempotencyKey: string | null;
  declare data: ScanData;
  declare scannedAt: Date;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Scan.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        jobId: { type: DataTypes.UUID, allowNull: false },
        stepIndex: { type: DataTypes.SMALLINT, allowNull: false },
        step: { type: DataTypes.STRING(10), allowNull: false },
        action: { type: DataTypes.STRING(10), allowNull: false },
        station: { type: DataTypes.STRING(60), allowNull: false },
        operatorId: { type: DataTypes.UUID, allowNull: true },
        idempotencyKey: { type: DataTypes.STRING(100), allowNull: true },
        data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        scannedAt: { type: DataTypes.DATE, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "scans", modelName: "Scan", updatedAt: false },
    );
  }
}
