import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize, type Transaction } from "sequelize";

/** One row of the append-only trail: who did what to which record, when and from where. */
export class Event extends Model<InferAttributes<Event>, InferCreationAttributes<Event>> {
  declare id: CreationOptional<string>;
  declare actorId: string | null;
  declare organizationId: string | null;
  declare action: string;
  declare subjectType: string;
  declare subjectId: string | null;
  declare data: CreationOptional<Record<string, unknown>>;
  declare ip: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Event.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        actorId: { type: DataTypes.UUID, allowNull: true },
        organizationId: { type: DataTypes.UUID, allowNull: true },
        action: { type: DataTypes.STRING(100), allowNull: false },
        subjectType: { type: DataTypes.STRING(60), allowNull: false },
        subjectId: { type: DataTypes.STRING(80), allowNull: true },
        data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        ip: { type: DataTypes.STRING(64), allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "events", modelName: "Event", updatedAt: false },
    );
  }
}

export interface EventProps {
  actor?: { id: string; organizationId?: string | null } | null;
  organizationId?: string | null;
  action: string;
  subject: { type: string; id?: string | null };
  data?: Record<string, unknown>;
  ip?: string | null;
  /** when it happened, if not now (the demo scenario's past) */
  at?: Date;
}

/** Write the trail row inside the caller's transaction, so the record and its event commit together. */
export function recordEvent(props: EventProps, transaction: Transaction): Promise<Event> {
  return Event.create(
    {
      actorId: props.actor?.id ?? null,
      organizationId: props.organizationId ?? props.actor?.organizationId ?? null,
      action: props.action,
      subjectType: props.subject.type,
      subjectId: props.subject.id ?? null,
      data: props.data ?? {},
      ip: props.ip ?? null,
      ...(props.at ? { createdAt: props.at } : {}),
    },
    { transaction },
  );
}
