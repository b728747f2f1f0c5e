import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** One sampled part's attenuation, measured after the anneal (append-only). */
export class Measurement extends Model<InferAttributes<Measurement>, InferCreationAttributes<Measurement>> {
  declare id: CreationOptional<string>;
  declare lotId: string;
  /** the lot's inspection round (a lot annealed again is sampled again) */
  declare round: number;
  declare serial: string;
  declare frequencyHz: number;
  declare appliedFieldUt: number;
  declare insideFieldUt: number;
  declare orientation: "transverse" | "axial";
  declare probePosition: string;
  declare instrumentId: string;
  /** YYYY-MM-DD: the instrument's calibration due date when it was used */
  declare instrumentCalibrationDue: string;
  declare derivation: CreationOptional<Record<string, unknown>>;
  declare shieldingFactor: number;
  declare attenuationDb: number;
  declare requiredDb: number;
  declare predictedDb: number | null;
  declare pass: boolean;
  declare source: CreationOptional<"entry" | "csv">;
  declare measuredById: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Measurement.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        lotId: { type: DataTypes.UUID, allowNull: false },
        round: { type: DataTypes.SMALLINT, allowNull: false },
        serial: { type: DataTypes.STRING(60), allowNull: false },
        frequencyHz: { type: DataTypes.DOUBLE, allowNull: false, field: "frequency_hz" },
        appliedFieldUt: { type: DataTypes.DOUBLE, allowNull: false, field: "applied_field_ut" },
        insideFieldUt: { type: DataTypes.DOUBLE, allowNull: false, field: "inside_field_ut" },
        orientation: { type: DataTypes.STRING(12), allowNull: false },
        probePosition: { type: DataTypes.STRING(120), allowNull: false },
        instrumentId: { type: DataTypes.UUID, allowNull: false },
        instrumentCalibrationDue: { type: DataTypes.DATEONLY, allowNull: false },
        derivation: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        shieldingFactor: { type: DataTypes.DOUBLE, allowNull: false },
        attenuationDb: { type: DataTypes.DOUBLE, allowNull: false, field: "attenuation_db" },
        requiredDb: { type: DataTypes.DOUBLE, allowNull: false, field: "required_db" },
        predictedDb: { type: DataTypes.DOUBLE, allowNull: true, field: "predicted_db" },
        pass: { type: DataTypes.BOOLEAN, allowNull: false },
        source: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "entry" },
        measuredById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "measurements", modelName: "Measurement", updatedAt: false },
    );
  }
}
