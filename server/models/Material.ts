import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { materialLibrary, type MaterialProperties, type MuPoint } from "../../shared/physics/materials";

// The library's own order (nickel-iron first, the conductors last), then additions as they came.
const libraryRank = new Map(materialLibrary.map((m, i) => [m.id, i]));

/** One alloy or metal of the library: what the prediction and the flat-blank engines compute with. */
export class Material extends Model<InferAttributes<Material>, InferCreationAttributes<Material>> {
  declare id: string;
  declare name: string;
  declare muInitial: number;
  declare muMaximum: number;
  declare saturationT: number | null;
  declare resistivityOhmM: number;
  declare densityKgM3: number;
  declare muCurve: MuPoint[];
  declare asFormedFactor: number;
  declare source: string;
  /** value name → where it comes from, marked [pub], [practice], [memory] or [derived] */
  declare sourceTags: CreationOptional<Record<string, string>>;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    // The database returns DOUBLE as numbers already; explicit field names because the
    // attribute names carry units (saturation_T) that underscoring would mangle.
    Material.init(
      {
        id: { type: DataTypes.STRING(40), primaryKey: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        muInitial: { type: DataTypes.DOUBLE, allowNull: false, field: "mu_initial" },
        muMaximum: { type: DataTypes.DOUBLE, allowNull: false, field: "mu_maximum" },
        saturationT: { type: DataTypes.DOUBLE, allowNull: true, field: "saturation_t" },
        resistivityOhmM: { type: DataTypes.DOUBLE, allowNull: false, field: "resistivity_ohm_m" },
        densityKgM3: { type: DataTypes.DOUBLE, allowNull: false, field: "density_kg_m3" },
        muCurve: { type: DataTypes.JSONB, allowNull: false, field: "mu_curve" },
        asFormedFactor: { type: DataTypes.DOUBLE, allowNull: false, field: "as_formed_factor" },
        source: { type: DataTypes.TEXT, allowNull: false },
        sourceTags: { type: DataTypes.JSONB, allowNull: false, defaultValue: {}, field: "source_tags" },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "materials", modelName: "Material" },
    );
  }

  /** Every row (or only the active ones) in the library's order. */
  static async ordered(where: { active?: boolean } = {}): Promise<Material[]> {
    const rows = await Material.findAll({ where, order: [["createdAt", "ASC"], ["id", "ASC"]] });
    const rank = (m: Material) => libraryRank.get(m.id) ?? libraryRank.size;
    return rows.sort((a, b) => rank(a) - rank(b)); // stable: additions keep their creation order
  }

  /** The engine's view of the row. */
  toProperties(): MaterialProperties {
    return {
      id: this.id,
      name: this.name,
      relativePermeability: { initial: this.muInitial, maximum: this.muMaximum },
      saturation_T: this.saturationT,
      resistivity_ohm_m: this.resistivityOhmM,
      density_kg_m3: this.densityKgM3,
      muCurve: this.muCurve,
      asFormedFactor: this.asFormedFactor,
      source: this.source,
    };
  }
}

/** The API's and the admin form's field names → model attributes. */
export function materialAttributes(m: Omit<MaterialProperties, "id"> & { sourceTags: Record<string, string>; active: boolean }) {
  return {
    name: m.name,
    muInitial: m.relativePermeability.initial,
    muMaximum: m.relativePermeability.maximum,
    saturationT: m.saturation_T,
    resistivityOhmM: m.resistivity_ohm_m,
    densityKgM3: m.density_kg_m3,
    muCurve: m.muCurve,
    asFormedFactor: m.asFormedFactor,
    source: m.source,
    sourceTags: m.sourceTags,
    active: m.active,
  };
}
