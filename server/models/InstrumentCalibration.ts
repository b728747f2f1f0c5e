import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { StoredFile } from "./StoredFile";

/** One calibration of an instrument, with its certificate; never changed once recorded. */
export class InstrumentCalibration extends Model<InferAttributes<InstrumentCalibration>, InferCreationAttributes<InstrumentCalibration>> {
  declare id: CreationOptional<string>;
  declare instrumentId: string;
  declare calibratedOn: string;
  declare calibrationDue: string;
  declare laboratory: string | null;
  declare certificateNumber: string | null;
  declare storedFileId: string | null;
  declare recordedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare file?: NonAttribute<StoredFile | null>;

  static initModel(sequelize: Sequelize) {
    InstrumentCalibration.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        instrumentId: { type: DataTypes.UUID, allowNull: false },
        calibratedOn: { type: DataTypes.DATEONLY, allowNull: false },
        calibrationDue: { type: DataTypes.DATEONLY, allowNull: false },
        laboratory: { type: DataTypes.STRING(160), allowNull: true },
        certificateNumber: { type: DataTypes.STRING(80), allowNull: true },
        storedFileId: { type: DataTypes.UUID, allowNull: true, unique: true },
        recordedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "instrument_calibrations", modelName: "InstrumentCalibration", updatedAt: false },
    );
  }
}
