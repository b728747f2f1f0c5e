import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A payment-service event the app has processed (once: the id is the key) and what came of it. */
export class WebhookEvent extends Model<InferAttributes<WebhookEvent>, InferCreationAttributes<WebhookEvent>> {
  declare id: string;
  declare type: string;
  declare outcome: string;
  declare orderId: string | null;
  declare payload: Record<string, unknown>;
  declare receivedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    WebhookEvent.init(
      {
        id: { type: DataTypes.STRING(255), primaryKey: true },
        type: { type: DataTypes.STRING(100), allowNull: false },
        outcome: { type: DataTypes.STRING(40), allowNull: false },
        orderId: { type: DataTypes.UUID, allowNull: true },
        payload: { type: DataTypes.JSONB, allowNull: false },
        receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: "webhook_events", modelName: "WebhookEvent", timestamps: false },
    );
  }
}
