// Integration-test context: createApp() on a fresh, migrated database with the demo accounts.
import { pino } from "pino";
import request from "supertest";
import type { Express } from "express";
import type { Role } from "../../shared/permissions";
import { createApp } from "../../server/app";
import { connect, type Db } from "../../server/db/client";
import { createSciencePool, type SciencePool } from "../../server/workers/science-pool";
import { memberships, users } from "../../server/db/schema";
import { hashPassword } from "../../server/services/passwords";
import type { Config } from "../../server/config";
import { requestHeader } from "../../shared/schemas/auth";
import { demoPassword, seedDemo } from "../../server/seed/demo";
import { testConfig } from "./config";
import { createTestDatabase, type TestDatabase } from "./db";

export interface TestContext {
  app: Express;
  /** The app's own handle (the application's role, under row-level security), for workers. */
  appDb: Db;
  config: Config;
  database: TestDatabase;
  mailQueued: { count: number };
  science: SciencePool;
  close: () => Promise<void>;
}

export async function createTestContext(
  overrides: Record<string, string> = {},
): Promise<TestContext> {
  const database = await createTestDatabase();
  await seedDemo(database.db, "test");
  const config = testConfig({ DATABASE_URL: database.url, ...overrides });
  const mailQueued = { count: 0 };
  const science = createSciencePool(1);
  // The app runs as the application's role, under row-level security; fixtures use database.db.
  const appDatabase = connect(database.url);
  const app = createApp({
    config,
    db: appDatabase.db,
    log: pino({ level: "silent" }),
    onMailQueued: () => (mailQueued.count += 1),
    science,
  });
  const close = async () => {
    await science.close();
    await appDatabase.close();
    await database.drop();
  };
  return { app, appDb: appDatabase.db, config, database, mailQueued, science, close };
}

export const withHeader = (test: request.Test) => test.set(requestHeader.name, requestHeader.value);

export async function signInAs(app: Express, role: string) {
  const res = await withHeader(request(app).post("/api/auth/sign-in")).send({
    email: `${role}@demo.equipot.test`,
    password: demoPassword,
  });
  if (res.status !== 200)
    throw new Error(`sign-in as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
  const body = res.body as {
    accessToken: string;
    memberships: { campaignId: string; campaignName: string }[];
  };
  const cookie = ([] as string[])
    .concat(res.headers["set-cookie"] ?? [])
    .find((c) => c.startsWith("equipot_refresh="));
  return {
    token: body.accessToken,
    memberships: body.memberships,
    cookie: cookie?.split(";")[0] ?? "",
    body: res.body,
  };
}

/** Signs in a new person who is a member (with `role`) of `campaignId` only: a stranger elsewhere. */
export async function outsiderToken(ctx: TestContext, campaignId: string, role: Role) {
  const email = `outsider-${crypto.randomUUID()}@practice.equipot.test`;
  const password = "outsider-password";
  const [outsider] = await ctx.database.db
    .insert(users)
    .values({ email, name: "Outsider", passwordHash: await hashPassword(password) })
    .returning();
  if (!outsider) throw new Error("the outsider was not created");
  await ctx.database.db.insert(memberships).values({ campaignId, userId: outsider.id, role });
  const res = await withHeader(request(ctx.app).post("/api/auth/sign-in")).send({
    email,
    password,
  });
  return (res.body as { accessToken: string }).accessToken;
}
