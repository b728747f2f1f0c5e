import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { CertificateContent } from "../../shared/schemas/quality";

/** An issued certificate of conformance: never changed (a database trigger refuses it); a correction is a new revision. */
export class Certificate extends Model<InferAttributes<Certificate>, InferCreationAttributes<Certificate>> {
  declare id: CreationOptional<string>;
  declare number: string;
  declare revision: number;
  declare lotId: string;
  declare orderId: string;
  declare organizationId: string;
  declare supersedesId: string | null;
  declare revisionReason: string | null;
  /** the certified content: what the digest is taken of */
  declare content: CertificateContent;
  declare digest: string;
  declare pdf: Buffer;
  declare pdfSha256: string;
  declare issuedById: string | null;
  declare issuedAt: Date;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Certificate.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        number: { type: DataTypes.STRING(20), allowNull: false },
        revision: { type: DataTypes.SMALLINT, allowNull: false },
        lotId: { type: DataTypes.UUID, allowNull: false },
        orderId: { type: DataTypes.UUID, allowNull: false },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        supersedesId: { type: DataTypes.UUID, allowNull: true },
        revisionReason: { type: DataTypes.TEXT, allowNull: true },
        content: { type: DataTypes.JSONB, allowNull: false },
        digest: { type: DataTypes.CHAR(64), allowNull: false },
        pdf: { type: DataTypes.BLOB, allowNull: false },
        pdfSha256: { type: DataTypes.CHAR(64), allowNull: false, field: "pdf_sha256" },
        issuedById: { type: DataTypes.UUID, allowNull: true },
        issuedAt: { type: DataTypes.DATE, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "certificates", modelName: "Certificate", updatedAt: false },
    );
  }
}
