import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

let database: TestDatabase;
beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(async () => {
  await database.drop();
});

describe("test database", () => {
  it("is migrated and empty", async () => {
    const result = await database.db.execute(sql`select count(*)::int as n from users`);
    expect(result.rows[0]).toEqual({ n: 0 });
  });
});
