import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A parcel that left the shop: carrier, tracking number and the lots in it. */
export class Shipment extends Model<InferAttributes<Shipment>, InferCreationAttributes<Shipment>> {
  declare id: CreationOptional<string>;
  declare orderId: string;
  declare carrier: string;
  declare trackingNumber: string;
  declare parts: Array<{ lotId: string; lotNumber: string; pieces: number }>;
  declare shippedAt: CreationOptional<Date>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Shipment.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        orderId: { type: DataTypes.UUID, allowNull: false },
        carrier: { type: DataTypes.STRING(100), allowNull: false },
        trackingNumber: { type: DataTypes.STRING(100), allowNull: false },
        parts: { type: DataTypes.JSONB, allowNull: false },
        shippedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "shipments", modelName: "Shipment", updatedAt: false },
    );
  }
}
