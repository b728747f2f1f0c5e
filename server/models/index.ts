import type { Sequelize } from "sequelize";
import { AuthToken } from "./AuthToken";
import { CheckoutSession } from "./CheckoutSession";
import { Design } from "./Design";
import { Event } from "./Event";
import { FurnaceRun } from "./FurnaceRun";
import { Certificate } from "./Certificate";
import { Instrument } from "./Instrument";
import { InstrumentCalibration } from "./InstrumentCalibration";
import { Invoice } from "./Invoice";
import { LotDisposition } from "./LotDisposition";
import { Measurement } from "./Measurement";
import { Nonconformance } from "./Nonconformance";
import { Job } from "./Job";
import { Lot } from "./Lot";
import { Material } from "./Material";
import { MaterialHeat } from "./MaterialHeat";
import { Order } from "./Order";
import { OrderFile } from "./OrderFile";
import { Organization } from "./Organization";
import { Payment } from "./Payment";
import { PriceListVersion } from "./PriceListVersion";
import { Quote } from "./Quote";
import { Scan } from "./Scan";
import { Shipment } from "./Shipment";
import { ShopSettings } from "./ShopSettings";
import { StoredFile } from "./StoredFile";
import { User } from "./User";
import { WebhookEvent } from "./WebhookEvent";

export { AuthToken, Event, Organization, StoredFile, User };
export { PriceListVersion };
export { Material };
export { CheckoutSession, Design, Invoice, Order, OrderFile, Payment, Quote, ShopSettings, WebhookEvent };
export { FurnaceRun, Job, Lot, MaterialHeat, Scan, Shipment };
export { Instrument, InstrumentCalibration };
export { Certificate, LotDisposition, Measurement, Nonconformance };
export { recordEvent } from "./Event";
export { paymentTotals } from "./Payment";

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

  // ordering
  for (const model of [Design, Quote, Order, OrderFile, CheckoutSession, Payment, WebhookEvent, Invoice, ShopSettings]) model.initModel(sequelize);
  Design.belongsTo(User, { foreignKey: "createdById", as: "createdBy" });
  Quote.belongsTo(User, { foreignKey: "createdById", as: "createdBy" });
  Quote.belongsTo(Organization, { foreignKey: "organizationId", as: "organization" });
  Order.belongsTo(User, { foreignKey: "createdById", as: "createdBy" });
  Order.belongsTo(Organization, { foreignKey: "organizationId", as: "organization" });
  Order.belongsTo(Quote, { foreignKey: "quoteId", as: "quote" });
  OrderFile.belongsTo(StoredFile, { foreignKey: "storedFileId", as: "file" });

  // shop floor
  for (const model of [MaterialHeat, FurnaceRun, Shipment, Lot, Job, Scan]) model.initModel(sequelize);
  MaterialHeat.belongsTo(StoredFile, { foreignKey: "millCertificateFileId", as: "millCertificate" });
  FurnaceRun.belongsTo(StoredFile, { foreignKey: "chartFileId", as: "chart" });
  Lot.belongsTo(Order, { foreignKey: "orderId", as: "order" });
  Job.belongsTo(Lot, { foreignKey: "lotId", as: "lot" });
  // quality: the instrument register
  for (const model of [Instrument, InstrumentCalibration]) model.initModel(sequelize);
  Instrument.belongsTo(StoredFile, { foreignKey: "currentCertificateId", as: "currentCertificate" });
  InstrumentCalibration.belongsTo(StoredFile, { foreignKey: "storedFileId", as: "file" });
  // quality: measurements, dispositions, nonconformances, certificates
  for (const model of [Measurement, LotDisposition, Nonconformance, Certificate]) model.initModel(sequelize);
}
