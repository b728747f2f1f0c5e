import request from "supertest";
import { Sequelize } from "sequelize";
import { describe, expect, it } from "vitest";
import { createApp } from "../../server/app";
import { testConfig } from "../support/app";

describe("GET /api/health with the database down", () => {
  it("answers 503 with database down, and no stack or secrets", async () => {
    // Port 9 on loopback has no PostgreSQL: the same as a database that went away.
    const url = "postgres://postgres@127.0.0.1:9/nowhere";
    const sequelize = new Sequelize(url, { dialect: "postgres", logging: false, pool: { acquire: 1500 } });
    const app = createApp({ config: testConfig({ DATABASE_URL: url }), sequelize, serveClient: false });
    const res = await request(app).get("/api/health");
    expect(res.status).toBe(503);
    expect(res.body).toEqual({ status: "degraded", database: "down" });
    await app.locals.close();
    await sequelize.close();
  });
});
