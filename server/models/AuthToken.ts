import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { Role } from "../../shared/schemas/auth";
import type { Organization } from "./Organization";

/** A single-use, expiring secret sent by mail: an invitation or a password reset. Only its SHA-256 is stored. */
export class AuthToken extends Model<InferAttributes<AuthToken>, InferCreationAttributes<AuthToken>> {
  declare id: CreationOptional<string>;
  declare kind: "invitation" | "password_reset";
  declare tokenHash: string;
  declare email: string;
  declare role: Role | null;
  declare organizationId: string | null;
  declare userId: string | null;
  declare createdById: string | null;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare organization?: NonAttribute<Organization | null>;

  static initModel(sequelize: Sequelize) {
    AuthToken.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        kind: { type: DataTypes.ENUM("invitation", "password_reset"), allowNull: false },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        email: { type: DataTypes.STRING(320), allowNull: false },
        role: { type: DataTypes.ENUM("customer", "operator", "qa", "admin"), allowNull: true },
        organizationId: { type: DataTypes.UUID, allowNull: true },
        userId: { type: DataTypes.UUID, allowNull: true },
        createdById: { type: DataTypes.UUID, allowNull: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "auth_tokens", modelName: "AuthToken" },
    );
  }
}
