import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { StoredFile } from "./StoredFile";

/** A drawing attached to an order (the file itself is a stored_files row). */
export class OrderFile extends Model<InferAttributes<OrderFile>, InferCreationAttributes<OrderFile>> {
  declare id: CreationOptional<string>;
  declare orderId: string;
  declare storedFileId: string;
  declare createdAt: CreationOptional<Date>;
  declare file?: NonAttribute<StoredFile>;

  static initModel(sequelize: Sequelize) {
    OrderFile.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        orderId: { type: DataTypes.UUID, allowNull: false },
        storedFileId: { type: DataTypes.UUID, allowNull: false, unique: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "order_files", modelName: "OrderFile", updatedAt: false },
    );
  }
}
