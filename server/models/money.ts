import { DataTypes, type ModelAttributeColumnOptions, type Model } from "sequelize";

/**
 * A BIGINT column of cents read back as a JavaScript number: pg returns BIGINT as a string, and
 * sums of cents stay far below 2^53.
 */
export function centsColumn(attribute: string, options: Partial<ModelAttributeColumnOptions> = {}): ModelAttributeColumnOptions {
  return {
    type: DataTypes.BIGINT,
    allowNull: false,
    ...options,
    get(this: Model) {
      const v = this.getDataValue(attribute as never) as unknown;
      return v === null || v === undefined ? v : Number(v);
    },
  };
}
