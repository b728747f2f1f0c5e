import { DataTypes, type QueryInterface, type Sequelize } from "sequelize";

// Organisations, users with roles, single-use auth tokens (invitations, password resets),
// the append-only event trail, stored files, sessions, and the sequences that number documents.
export async function up(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: sequelize.literal("gen_random_uuid()") };
  const stamps = {
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal("now()") },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal("now()") },
  };

  await qi.createTable("organizations", {
    id,
    name: { type: DataTypes.STRING(200), allowNull: false },
    kind: { type: DataTypes.ENUM("shop", "customer"), allowNull: false },
    ...stamps,
  });
  await qi.addIndex("organizations", ["name"], { unique: true });

  await qi.createTable("users", {
    id,
    email: { type: DataTypes.STRING(320), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    role: { type: DataTypes.ENUM("customer", "operator", "qa", "admin"), allowNull: false },
    organization_id: { type: DataTypes.UUID, allowNull: false, references: { model: "organizations", key: "id" } },
    password_hash: { type: DataTypes.STRING(100), allowNull: true },
    disabled_at: { type: DataTypes.DATE, allowNull: true },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex("users", ["organization_id"]);

  await qi.createTable("auth_tokens", {
    id,
    kind: { type: DataTypes.ENUM("invitation", "password_reset"), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    email: { type: DataTypes.STRING(320), allowNull: false },
    role: { type: DataTypes.ENUM("customer", "operator", "qa", "admin"), allowNull: true },
    organization_id: { type: DataTypes.UUID, allowNull: true, references: { model: "organizations", key: "id" } },
    user_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex("auth_tokens", ["email", "kind"]);

  await qi.createTable("events", {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    actor_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    organization_id: { type: DataTypes.UUID, allowNull: true, references: { model: "organizations", key: "id" } },
    action: { type: DataTypes.STRING(100), allowNull: false },
    subject_type: { type: DataTypes.STRING(60), allowNull: false },
    subject_id: { type: DataTypes.STRING(80), allowNull: true },
    data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    ip: { type: DataTypes.STRING(64), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: sequelize.literal("now()") },
  });
  await qi.addIndex("events", ["subject_type", "subject_id"]);
  await qi.addIndex("events", ["organization_id", "created_at"]);
  // The trail is append-only: the database refuses edits and deletions.
  await sequelize.query(`
    create function events_append_only() returns trigger language plpgsql as $$
    begin raise exception 'events are append-only'; end $$;
    create trigger events_no_update before update or delete on events
      for each row execute function events_append_only();`);

  await qi.createTable("stored_files", {
    id,
    organization_id: { type: DataTypes.UUID, allowNull: true, references: { model: "organizations", key: "id" } },
    uploaded_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    purpose: { type: DataTypes.STRING(60), allowNull: false },
    filename: { type: DataTypes.STRING(255), allowNull: false },
    content_type: { type: DataTypes.STRING(120), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    storage_key: { type: DataTypes.STRING(255), allowNull: false, unique: true },
    ...stamps,
  });

  // connect-pg-simple's table.
  await sequelize.query(`
    create table "session" ("sid" varchar not null primary key, "sess" json not null, "expire" timestamp(6) not null);
    create index "session_expire_idx" on "session" ("expire");`);

  // Document numbers (quotes, orders, lots, certificates) come from sequences: gap-tolerant, never reused.
  for (const name of ["quote", "order", "lot", "certificate", "job"]) {
    await sequelize.query(`create sequence ${name}_number_seq start 1001`);
  }
}

export async function down(qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  for (const name of ["quote", "order", "lot", "certificate", "job"]) await sequelize.query(`drop sequence if exists ${name}_number_seq`);
  await sequelize.query(`drop table if exists "session"`);
  await qi.dropTable("stored_files");
  await sequelize.query(`drop trigger if exists events_no_update on events; drop function if exists events_append_only()`);
  await qi.dropTable("events");
  await qi.dropTable("auth_tokens");
  await qi.dropTable("users");
  await qi.dropTable("organizations");
  await sequelize.query(`drop type if exists enum_organizations_kind, enum_users_role, enum_auth_tokens_kind, enum_auth_tokens_role`);
}
