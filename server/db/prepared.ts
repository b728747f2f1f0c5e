import type { Sequelize, Transaction } from "sequelize";

/** A statement PostgreSQL plans once per connection and keeps (the scan station's hot path). */
export interface PreparedStatement {
  /** unique across the app: the connection keeps the plan under this name */
  name: string;
  text: string;
}

type PgConnection = { query(config: { name: string; text: string; values: unknown[] }): Promise<{ rows: unknown[] }> };

/**
 * Runs a named statement on the transaction's own connection (or a pooled one for a single read).
 * Sequelize sends every statement unnamed, so PostgreSQL plans it again each time; for the few
 * statements a scan runs, planning cost more than executing (several joins and sub-selects).
 */
export async function prepared<T>(sequelize: Sequelize, statement: PreparedStatement, values: unknown[], transaction?: Transaction): Promise<T[]> {
  const run = async (connection: PgConnection) => (await connection.query({ name: statement.name, text: statement.text, values })).rows as T[];
  if (transaction) return run((transaction as unknown as { connection: PgConnection }).connection);
  const connection = (await sequelize.connectionManager.getConnection({ type: "read" })) as PgConnection;
  try {
    return await run(connection);
  } finally {
    sequelize.connectionManager.releaseConnection(connection);
  }
}
