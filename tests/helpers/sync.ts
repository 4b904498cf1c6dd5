// Small builders for sync tests: a client that numbers its own mutations like a tablet does.
import request from "supertest";
import type { Express } from "express";
import type { Db } from "../../server/db/client";
import { campaigns, crates, sites } from "../../server/db/schema";
import {
  protocolVersion,
  type MutationName,
  type PullResponse,
  type PushResponse,
} from "../../shared/sync/protocol";

export interface TestSyncClient {
  clientId: string;
  next: number;
  mutation: (
    name: MutationName,
    args: unknown,
  ) => { mutationId: number; name: MutationName; args: unknown; createdAt: string };
}

export function syncClient(): TestSyncClient {
  const client: TestSyncClient = {
    clientId: crypto.randomUUID(),
    next: 1,
    mutation: (name, args) => ({
      mutationId: client.next++,
      name,
      args,
      createdAt: new Date().toISOString(),
    }),
  };
  return client;
}

export async function pushAs(
  app: Express,
  token: string,
  body: { clientId: string; campaignId: string; mutations: unknown[]; protocolVersion?: number },
): Promise<{ status: number; body: PushResponse & { error?: { code: string; message: string } } }> {
  const res = await request(app)
    .post("/api/sync/push")
    .set("Authorization", `Bearer ${token}`)
    .send({ protocolVersion, ...body });
  return { status: res.status, body: res.body };
}

export async function pullAll(
  app: Express,
  token: string,
  campaignId: string,
  clientId?: string,
  limit = 500,
) {
  let cursor = 0;
  const pages: PullResponse[] = [];
  for (;;) {
    const res = await request(app)
      .get("/api/sync/pull")
      .query({
        protocolVersion,
        campaign: campaignId,
        cursor,
        limit,
        ...(clientId ? { clientId } : {}),
      })
      .set("Authorization", `Bearer ${token}`);
    if (res.status !== 200)
      throw new Error(`pull failed: ${res.status} ${JSON.stringify(res.body)}`);
    const page = res.body as PullResponse;
    pages.push(page);
    cursor = page.cursor;
    if (!page.hasMore) return { pages, cursor, changes: pages.flatMap((p) => p.changes) };
  }
}

export const newSite = (overrides: Record<string, unknown> = {}) => ({
  id: crypto.randomUUID(),
  name: "Offline shed",
  kind: "mountain",
  latitudeDeg: 47.08,
  longitudeDeg: 11.22,
  approxHeightM: 2860,
  notes: "",
  ...overrides,
});

/** Another campaign with one site in it, for tests that nothing crosses between campaigns. */
export async function foreignCampaignWithSite(db: Db, label: string) {
  const [other] = await db
    .insert(campaigns)
    .values({ name: `Campaign ${label}`, description: `${label.toLowerCase()}-secret` })
    .returning();
  if (!other) throw new Error("the other campaign was not created");
  const siteId = crypto.randomUUID();
  await db.insert(sites).values({
    ...newSite({ id: siteId, name: `${label}-only site` }),
    kind: "depot",
    campaignId: other.id,
    changeSeq: 1,
  });
  return { campaignId: other.id, siteId };
}

/** A crate written straight into a campaign (crates are read-only on tablets for now). */
export async function insertCrate(
  db: Db,
  campaignId: string,
  overrides: Partial<typeof crates.$inferInsert> = {},
) {
  const id = crypto.randomUUID();
  await db.insert(crates).values({
    id,
    campaignId,
    label: "XC-99",
    contents: "Spare optics",
    weightKg: 20,
    maxShockG: 30,
    temperatureMinC: 10,
    temperatureMaxC: 30,
    changeSeq: 1,
    ...overrides,
  });
  return id;
}
