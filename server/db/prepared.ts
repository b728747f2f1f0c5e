import type { Sequelize, Transaction } from "sequelize";

/** A statement PostgreSQL plans once per connection and keeps (the scan station's hot path). */
export interface PreparedStatement {
  /** unique across the app: the connection keeps the plan under this name */
  name: string;
  text: string;
  /** the statement answers one json column `r` per row (see jsonRows) */
  jsonRows?: true;
}

/**
 * A wide select answered as one json value per row. node-postgres reads the row description of
 * every column on each execution and builds each row by copying a dictionary of all its names, so
 * the code that reads a 45-column row afterwards takes V8's slow property paths; one json column is
 * parsed by JSON.parse into ordinary fast objects. Timestamps come back as ISO text.
 */
export const jsonRows = (select: string) => `select row_to_json(r) as r from (${select}) r`;

type PgConnection = { query(config: { name: string; text: string; values: unknown[] }): Promise<{ rows: unknown[] }> };

/**
 * Runs a named statement on the transaction's own connection (or a pooled one for a single read).
 * Sequelize sends every statement unnamed, so PostgreSQL plans it again each time; for the few
 * statements a scan runs, planning cost more than executing (several joins and sub-selects).
 */
export async function prepared<T>(sequelize: Sequelize, statement: PreparedStatement, values: unknown[], transaction?: Transaction): Promise<T[]> {
  const run = async (connection: PgConnection) => {
    const { rows } = await connection.query({ name: statement.name, text: statement.text, values });
    return (statement.jsonRows ? rows.map((row) => (row as { r: T }).r) : rows) as T[];
  };
  if (transaction) return run((transaction as unknown as { connection: PgConnection }).connection);
  const connection = (await sequelize.connectionManager.getConnection({ type: "read" })) as PgConnection;
  try {
    return await run(connection);
  } finally {
    sequelize.connectionManager.releaseConnection(connection);
  }
}
