import pg from "pg";

/** A digest the seeded bench database holds (the demo's certificates); all zeros when there is none (then the route answers 404). */
export async function certificateDigestForBench(): Promise<string> {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  try {
    await client.connect();
    const { rows } = await client.query<{ digest: string }>("select digest from certificates order by issued_at desc limit 1");
    return rows[0]?.digest ?? "0".repeat(64);
  } catch {
    return "0".repeat(64);
  } finally {
    await client.end().catch(() => {});
  }
}
