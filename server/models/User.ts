import {
  DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes,
  type NonAttribute, type Sequelize,
} from "sequelize";
import type { Role } from "../../shared/schemas/auth";
import type { Organization } from "./Organization";

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare organizationId: ForeignKey<Organization["id"]>;
  declare passwordHash: string | null;
  declare disabledAt: CreationOptional<Date | null>;
  declare lastSignInAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare organization?: NonAttribute<Organization>;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        email: { type: DataTypes.STRING(320), allowNull: false, unique: true, set(v: string) { this.setDataValue("email", v.trim().toLowerCase()); } },
        name: { type: DataTypes.STRING(200), allowNull: false },
        role: { type: DataTypes.ENUM("customer", "operator", "qa", "admin"), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: true },
        disabledAt: { type: DataTypes.DATE, allowNull: true },
        lastSignInAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "users", modelName: "User" },
    );
  }
}
