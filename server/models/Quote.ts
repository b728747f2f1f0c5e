import { DataTypes, Model, literal, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { PriceBuildUp } from "../../shared/fabrication";
import type { PredictionResult } from "../../shared/physics/predict";
import type { QuoteBlank, QuoteConfiguration, QuoteStatus } from "../../shared/schemas/quote";
import { centsColumn } from "./money";
import type { Organization } from "./Organization";
import type { User } from "./User";

/** A priced configuration, frozen: nothing but the reminder stamp changes after it is made. */
export class Quote extends Model<InferAttributes<Quote>, InferCreationAttributes<Quote>> {
  declare id: CreationOptional<string>;
  /** from the document sequence, assigned by the insert */
  declare number: CreationOptional<number>;
  declare organizationId: string;
  declare createdById: string | null;
  declare designId: string | null;
  declare requotedFromId: string | null;
  declare configuration: QuoteConfiguration;
  declare prediction: PredictionResult;
  declare blank: QuoteBlank;
  /** the whole build-up, rates and margin included (customers see a selling view of it) */
  declare price: PriceBuildUp;
  declare priceListId: string;
  declare priceListVersion: number;
  declare quantity: number;
  declare unitPriceCents: number;
  declare totalCents: number;
  declare currency: string;
  declare massKg: number | null;
  declare leadTimeWorkingDays: number;
  declare validityDays: number;
  declare expiresAt: Date;
  declare expiryReminderSentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare organization?: NonAttribute<Organization>;
  declare createdBy?: NonAttribute<User | null>;
  /** set by the loaders that ask for it */
  declare orderId?: NonAttribute<string | null>;

  isExpired(now = new Date()): boolean {
    return this.expiresAt.getTime() <= now.getTime();
  }

  statusAt(orderId: string | null | undefined, now = new Date()): QuoteStatus {
    if (orderId) return "ordered";
    return this.isExpired(now) ? "expired" : "open";
  }

  static initModel(sequelize: Sequelize) {
    Quote.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        number: { type: DataTypes.INTEGER, allowNull: false, unique: true, defaultValue: literal("nextval('quote_number_seq')") },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        createdById: { type: DataTypes.UUID, allowNull: true },
        designId: { type: DataTypes.UUID, allowNull: true },
        requotedFromId: { type: DataTypes.UUID, allowNull: true },
        configuration: { type: DataTypes.JSONB, allowNull: false },
        prediction: { type: DataTypes.JSONB, allowNull: false },
        blank: { type: DataTypes.JSONB, allowNull: false },
        price: { type: DataTypes.JSONB, allowNull: false },
        priceListId: { type: DataTypes.UUID, allowNull: false },
        priceListVersion: { type: DataTypes.INTEGER, allowNull: false },
        quantity: { type: DataTypes.INTEGER, allowNull: false },
        unitPriceCents: centsColumn("unitPriceCents"),
        totalCents: centsColumn("totalCents"),
        currency: { type: DataTypes.STRING(3), allowNull: false },
        massKg: { type: DataTypes.DOUBLE, allowNull: true },
        leadTimeWorkingDays: { type: DataTypes.INTEGER, allowNull: false },
        validityDays: { type: DataTypes.INTEGER, allowNull: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        expiryReminderSentAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "quotes", modelName: "Quote" },
    );
  }
}
