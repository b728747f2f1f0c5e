import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { SamplingPlanJson } from "../../shared/schemas/sampling";

/** A lot accepted or rejected under its sampling plan, once per inspection round. */
export class LotDisposition extends Model<InferAttributes<LotDisposition>, InferCreationAttributes<LotDisposition>> {
  declare id: CreationOptional<string>;
  declare lotId: string;
  declare round: number;
  declare decision: "accepted" | "rejected";
  declare plan: SamplingPlanJson;
  declare measured: number;
  declare failures: number;
  /** accepted by concession: the customer's written consent */
  declare concession: string | null;
  declare decidedById: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    LotDisposition.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        lotId: { type: DataTypes.UUID, allowNull: false },
        round: { type: DataTypes.SMALLINT, allowNull: false },
        decision: { type: DataTypes.STRING(10), allowNull: false },
        plan: { type: DataTypes.JSONB, allowNull: false },
        measured: { type: DataTypes.INTEGER, allowNull: false },
        failures: { type: DataTypes.INTEGER, allowNull: false },
        concession: { type: DataTypes.TEXT, allowNull: true },
        decidedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "lot_dispositions", modelName: "LotDisposition", updatedAt: false },
    );
  }
}
