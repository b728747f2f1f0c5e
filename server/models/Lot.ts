import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { Order } from "./Order";

/** The pieces of one order and alloy that go through one furnace run and are certified together. */
export class Lot extends Model<InferAttributes<Lot>, InferCreationAttributes<Lot>> {
  declare id: CreationOptional<string>;
  declare seq: number;
  declare number: string;
  declare orderId: string;
  declare materialId: string;
  /** finished pieces (end caps and collars count with the piece they are welded to) */
  declare pieces: number;
  /** the furnace load, kg */
  declare massKg: number;
  /** YYYY-MM-DD */
  declare dueDate: string;
  declare furnaceRunId: CreationOptional<string | null>;
  declare holdReason: CreationOptional<string | null>;
  declare heldAt: CreationOptional<Date | null>;
  declare heldById: CreationOptional<string | null>;
  declare shipmentId: CreationOptional<string | null>;
  /** quality: the inspection round (a lot sent back for another anneal is sampled again) */
  declare inspectionRound: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare order?: NonAttribute<Order>;

  static initModel(sequelize: Sequelize) {
    Lot.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        seq: { type: DataTypes.INTEGER, allowNull: false, unique: true },
        number: { type: DataTypes.STRING(20), allowNull: false, unique: true },
        orderId: { type: DataTypes.UUID, allowNull: false },
        materialId: { type: DataTypes.STRING(40), allowNull: false },
        pieces: { type: DataTypes.INTEGER, allowNull: false },
        massKg: { type: DataTypes.DOUBLE, allowNull: false, field: "mass_kg" },
        dueDate: { type: DataTypes.DATEONLY, allowNull: false },
        furnaceRunId: { type: DataTypes.UUID, allowNull: true },
        holdReason: { type: DataTypes.TEXT, allowNull: true },
        heldAt: { type: DataTypes.DATE, allowNull: true },
        heldById: { type: DataTypes.UUID, allowNull: true },
        shipmentId: { type: DataTypes.UUID, allowNull: true },
        inspectionRound: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "lots", modelName: "Lot" },
    );
  }
}
