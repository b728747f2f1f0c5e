import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { AnnealWindow, Furnace } from "../../shared/shop-floor/anneal";
import type { StoredFile } from "./StoredFile";

/** One hydrogen furnace load: its lots (all of one alloy), the record of the run, and its check against the alloy's window. */
export class FurnaceRun extends Model<InferAttributes<FurnaceRun>, InferCreationAttributes<FurnaceRun>> {
  declare id: CreationOptional<string>;
  declare seq: CreationOptional<number>;
  declare number: string;
  declare furnaceId: string;
  /** the furnace as the settings described it at the time */
  declare furnace: Furnace;
  declare materialId: string;
  declare setpointC: number | null;
  declare peakTemperatureC: number;
  declare soakMin: number;
  declare dewPointC: number;
  declare dewPointOutC: number | null;
  declare coolingRateCPerH: number;
  /** the window the record was checked against, frozen */
  declare window: AnnealWindow;
  declare withinWindow: boolean;
  declare deviations: string[];
  /** the load as recorded */
  declare lots: Array<{ id: string; number: string; pieces: number; mass_kg: number }>;
  declare pieces: number;
  declare loadKg: number;
  declare chartFileId: CreationOptional<string | null>;
  declare operatorId: string | null;
  declare notes: string | null;
  declare ranAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare chart?: NonAttribute<StoredFile | null>;

  static initModel(sequelize: Sequelize) {
    FurnaceRun.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        seq: { type: DataTypes.INTEGER, allowNull: false },
        number: { type: DataTypes.STRING(20), allowNull: false, unique: true },
        furnaceId: { type: DataTypes.STRING(20), allowNull: false },
        furnace: { type: DataTypes.JSONB, allowNull: false },
        materialId: { type: DataTypes.STRING(40), allowNull: false },
        setpointC: { type: DataTypes.DOUBLE, allowNull: true, field: "setpoint_c" },
        peakTemperatureC: { type: DataTypes.DOUBLE, allowNull: false, field: "peak_temperature_c" },
        soakMin: { type: DataTypes.DOUBLE, allowNull: false, field: "soak_min" },
        dewPointC: { type: DataTypes.DOUBLE, allowNull: false, field: "dew_point_c" },
        dewPointOutC: { type: DataTypes.DOUBLE, allowNull: true, field: "dew_point_out_c" },
        coolingRateCPerH: { type: DataTypes.DOUBLE, allowNull: false, field: "cooling_rate_c_per_h" },
        window: { type: DataTypes.JSONB, allowNull: false },
        withinWindow: { type: DataTypes.BOOLEAN, allowNull: false },
        deviations: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        lots: { type: DataTypes.JSONB, allowNull: false },
        pieces: { type: DataTypes.INTEGER, allowNull: false },
        loadKg: { type: DataTypes.DOUBLE, allowNull: false, field: "load_kg" },
        chartFileId: { type: DataTypes.UUID, allowNull: true },
        operatorId: { type: DataTypes.UUID, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        ranAt: { type: DataTypes.DATE, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "furnace_runs", modelName: "FurnaceRun" },
    );
  }
}
