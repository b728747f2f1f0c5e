import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { FlatPatternGeometry } from "../../shared/fabrication";
import type { JobPartJson } from "../../shared/schemas/jobs";
import type { PartRole, RoutingStep, StepKey } from "../../shared/shop-floor/routing";
import type { Lot } from "./Lot";

/** One part of an order's design, for the ordered quantity: its blank, its routing and where it stands. */
export class Job extends Model<InferAttributes<Job>, InferCreationAttributes<Job>> {
  declare id: CreationOptional<string>;
  declare seq: CreationOptional<number>;
  /** the value printed in the job's barcode (generated from seq by the database) */
  declare code: CreationOptional<string>;
  declare orderId: string;
  declare lotId: string;
  declare assemblyJobId: string | null;
  /** 0 = innermost */
  declare layer: number;
  declare role: PartRole;
  declare method: "drawn" | "rolled" | "bent";
  declare materialId: string;
  declare thicknessMm: number;
  declare quantity: number;
  declare finishedPiece: boolean;
  declare blank: JobPartJson["blank"];
  declare flatPattern: FlatPatternGeometry;
  declare areaMm2: number;
  declare massKg: number | null;
  declare drawStages: number;
  declare processAnneals: number;
  declare weldLengthMm: number;
  declare routing: RoutingStep[];
  declare stepIndex: CreationOptional<number>;
  declare stepStartedAt: CreationOptional<Date | null>;
  declare currentStep: StepKey | null;
  declare annealIndex: number | null;
  declare heatId: CreationOptional<string | null>;
  declare furnaceRunId: CreationOptional<string | null>;
  /** YYYY-MM-DD */
  declare dueDate: string;
  declare completedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare lot?: NonAttribute<Lot>;

  static initModel(sequelize: Sequelize) {
    Job.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        seq: { type: DataTypes.INTEGER, allowNull: false },
        code: { type: DataTypes.STRING(20), allowNull: false },
        orderId: { type: DataTypes.UUID, allowNull: false },
        lotId: { type: DataTypes.UUID, allowNull: false },
        assemblyJobId: { type: DataTypes.UUID, allowNull: true },
        layer: { type: DataTypes.SMALLINT, allowNull: false },
        role: { type: DataTypes.STRING(10), allowNull: false },
        method: { type: DataTypes.STRING(10), allowNull: false },
        materialId: { type: DataTypes.STRING(40), allowNull: false },
        thicknessMm: { type: DataTypes.DOUBLE, allowNull: false, field: "thickness_mm" },
        quantity: { type: DataTypes.INTEGER, allowNull: false },
        finishedPiece: { type: DataTypes.BOOLEAN, allowNull: false },
        blank: { type: DataTypes.JSONB, allowNull: false },
        flatPattern: { type: DataTypes.JSONB, allowNull: false },
        areaMm2: { type: DataTypes.DOUBLE, allowNull: false, field: "area_mm2" },
        massKg: { type: DataTypes.DOUBLE, allowNull: true, field: "mass_kg" },
        drawStages: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 0 },
        processAnneals: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 0 },
        weldLengthMm: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0, field: "weld_length_mm" },
        routing: { type: DataTypes.JSONB, allowNull: false },
        stepIndex: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 0 },
        stepStartedAt: { type: DataTypes.DATE, allowNull: true },
        currentStep: { type: DataTypes.STRING(10), allowNull: true },
        annealIndex: { type: DataTypes.SMALLINT, allowNull: true },
        heatId: { type: DataTypes.UUID, allowNull: true },
        furnaceRunId: { type: DataTypes.UUID, allowNull: true },
        dueDate: { type: DataTypes.DATEONLY, allowNull: false },
        completedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      // seq and code come from the database (the job sequence and the generated column)
      { sequelize, tableName: "jobs", modelName: "Job" },
    );
  }
}
