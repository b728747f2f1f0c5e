import PgBoss from "pg-boss";
import type { QueryInterface, Sequelize } from "sequelize";

// The job queue (mail) lives in PostgreSQL: pg-boss's own schema, installed here so that the
// schema is part of the migrated database and app processes never race to create it.
export const JOB_SCHEMA = "pgboss";

export async function up(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(PgBoss.getConstructionPlans(JOB_SCHEMA));
}

export async function down(_qi: QueryInterface, sequelize: Sequelize): Promise<void> {
  await sequelize.query(`drop schema if exists ${JOB_SCHEMA} cascade`);
}
