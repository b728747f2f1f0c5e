import type { Sequelize } from "sequelize";
import { AuthToken } from "./AuthToken";
import { Event } from "./Event";
import { Material } from "./Material";
import { Organization } from "./Organization";
import { PriceListVersion } from "./PriceListVersion";
import { StoredFile } from "./StoredFile";
import { User } from "./User";

export { AuthToken, Event, Organization, StoredFile, User };
export { PriceListVersion };
export { Material };
export { recordEvent } from "./Event";

let bound: Sequelize | undefined;

/** Bind every model to the instance once, and set up the associations. */
export function initModels(sequelize: Sequelize): void {
  if (bound === sequelize) return;
  bound = sequelize;
  for (const model of [Organization, User, AuthToken, Event, StoredFile]) model.initModel(sequelize);
  Organization.hasMany(User, { foreignKey: "organizationId", as: "users" });
  User.belongsTo(Organization, { foreignKey: "organizationId", as: "organization" });
  AuthToken.belongsTo(Organization, { foreignKey: "organizationId", as: "organization" });
  PriceListVersion.initModel(sequelize);
  PriceListVersion.belongsTo(User, { foreignKey: "createdById", as: "createdBy" });
  Material.initModel(sequelize);
}
