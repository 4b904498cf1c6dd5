// Load: many tablets, each the real sync engine over its own fake-indexeddb database, editing the
// same few sites and syncing at random against the real server on loopback, through a link that
// refuses requests, loses answers after the server committed and goes offline for stretches.
// Afterwards every tablet syncs until caught up, and then: every mutation was applied exactly once
// (or kept as a conflict or a refusal), nothing twice, every conflict reached every tablet, and all
// tablets hold exactly the server's sites. The figures go to the log and to
// test-artifacts/reliability/sync-load.json.
// Size: 8 tablets for 20 s; EQUIPOT_SOAK=1 makes it 50 tablets for 5 minutes (npm run test:soak).
// EQUIPOT_LOAD_TABLETS, EQUIPOT_LOAD_SECONDS and EQUIPOT_LOAD_SEED override either.
import { mkdirSync, writeFileSync } from "node:fs";
import { resolve } from "node:path";
import { monitorEventLoopDelay } from "node:perf_hooks";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, inArray } from "drizzle-orm";
import { createSiteLocally, deleteSiteLocally, updateSiteLocally } from "../../src/db/site-store";
import type { MutationResult } from "../../shared/sync/protocol";
import { startServer, type RunningServer } from "../../server/index";
import { demoPassword, seedDemo } from "../../server/seed/demo";
import {
  auditEvents,
  campaigns,
  conflicts,
  memberships,
  sites,
  syncClients,
  syncRejections,
  users,
} from "../../server/db/schema";
import { presentConflict } from "../../server/presenters/conflict";
import { presentSite } from "../../server/presenters/site";
import { testConfig } from "../helpers/config";
import { createTestDatabase, type TestDatabase } from "../helpers/db";
import {
  loadTablet,
  quantile,
  seededRandom,
  sleep,
  type LoadTablet,
} from "../helpers/load-tablets";

const soak = process.env.EQUIPOT_SOAK === "1";

function sizeFromEnv(name: string, fallback: number, max: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === "") return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < 1 || value > max)
    throw new Error(`${name} must be a whole number from 1 to ${max}, got "${raw}"`);
  return value;
}

const TABLETS = sizeFromEnv("EQUIPOT_LOAD_TABLETS", soak ? 50 : 8, 200);
const SECONDS = sizeFromEnv("EQUIPOT_LOAD_SECONDS", soak ? 300 : 20, 3600);
const SEED = sizeFromEnv("EQUIPOT_LOAD_SEED", 20271203, 2 ** 31);
// Paced so the whole fleet makes ~15 edits and ~12 syncs a second, whatever its size: the server,
// PostgreSQL and every tablet's IndexedDB share two cores here.
const EDIT_MS = Math.max(400, TABLETS * 60);
const SYNC_MS = Math.max(600, TABLETS * 80);
const SETTLE_MS = 180_000;
// Few sites for many tablets, so that the same fields are edited on several tablets at once.
const MIN_LIVE = 4;
const MAX_LIVE = Math.max(8, Math.ceil(TABLETS / 2));
const OFFLINE_CHANCE = 0.03;
const OFFLINE_MAX_MS = soak ? 10_000 : 3_000;
// Roles take turns: "field" may not delete, so some deletes are refused and kept for recovery.
const ROLES = ["logistics", "geodesist", "admin", "field"] as const;

let database: TestDatabase;
let server: RunningServer;

beforeAll(async () => {
  database = await createTestDatabase();
  await seedDemo(database.db, "test");
  server = await startServer(testConfig({ DATABASE_URL: database.url }));
});
afterAll(async () => {
  await server?.close();
  await database?.drop();
});

async function signIn(role: string): Promise<string> {
  const res = await fetch(`${server.url}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json", "x-equipot-request": "1" },
    body: JSON.stringify({ email: `${role}@demo.equipot.test`, password: demoPassword }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status}`);
  return ((await res.json()) as { accessToken: string }).accessToken;
}

/** A campaign of its own, with the four demo people as members, so the counts are this run's. */
async function loadCampaign(): Promise<string> {
  const [campaign] = await database.db
    .insert(campaigns)
    .values({ name: `Load ${SEED}` })
    .returning();
  if (!campaign) throw new Error("the load campaign was not created");
  const people = await database.db.select().from(users);
  for (const role of ROLES) {
    const person = people.find((p) => p.email === `${role}@demo.equipot.test`);
    if (!person) throw new Error(`no demo user for ${role}`);
    await database.db
      .insert(memberships)
      .values({ campaignId: campaign.id, userId: person.id, role });
  }
  return campaign.id;
}

type Field = "name" | "notes" | "approxHeightM";
interface Issued {
  tablet: number;
  mutationId: number;
  kind: "create" | "update" | "delete";
  site: string;
  field?: Field;
  value?: string | number;
}

describe("sync under load", () => {
  it(
    `${TABLETS} tablets editing and syncing for ${SECONDS} s through a flaky link lose nothing and converge`,
    async () => {
      const campaignId = await loadCampaign();
      const tokens = new Map<string, string>();
      for (const role of ROLES) tokens.set(role, await signIn(role));
      const tablets: LoadTablet[] = Array.from({ length: TABLETS }, (_, index) =>
        loadTablet({
          index,
          baseUrl: server.url,
          token: tokens.get(ROLES[index % ROLES.length] ?? "admin") ?? "",
          campaignId,
          faults: { refuse: 0.05, loseAnswer: 0.07 },
          random: seededRandom(SEED + 1000 + index),
        }),
      );
      const issued: Issued[] = [];
      const syncMs: number[] = [];
      let syncFailures = 0;
      let edits = 0;
      // One process holds the server and every tablet: its event-loop delay is part of each figure.
      const loopDelay = monitorEventLoopDelay({ resolution: 20 });
      loopDelay.enable();
      const started = Date.now();
      const deadline = started + SECONDS * 1000;

      const liveSites = (t: LoadTablet) =>
        t.db.sites
          .where("campaignId")
          .equals(campaignId)
          .filter((s) => !s.deletedAt)
          .toArray();

      // One local edit through the app's own store functions; values are unique across the run,
      // so each can be traced to the one audit row, conflict or refusal it must end in.
      async function edit(t: LoadTablet, random: () => number): Promise<void> {
        const live = await liveSites(t);
        const roll = random();
        edits += 1;
        const n = edits;
        let entry: Omit<Issued, "mutationId">;
        if (live.length < MIN_LIVE || (roll < 0.15 && live.length < MAX_LIVE)) {
          const id = await createSiteLocally(t.db, campaignId, {
            name: `Load hut ${n}`,
            kind: "other",
            latitudeDeg: 40 + random() * 10,
            longitudeDeg: 5 + random() * 10,
            // Below zero, where no edit's height goes: an edit never repeats a site's value.
            approxHeightM: -(n % 50_000) / 100,
            notes: "",
          });
          entry = { tablet: t.index, kind: "create", site: id };
        } else {
          const site = live[Math.floor(random() * live.length)];
          if (!site) return;
          if (roll < 0.27 && live.length > MIN_LIVE) {
            await deleteSiteLocally(t.db, campaignId, site.id);
            entry = { tablet: t.index, kind: "delete", site: site.id };
          } else {
            const fields: Field[] = ["name", "notes", "approxHeightM"];
            const field = fields[Math.floor(random() * fields.length)] ?? "notes";
            const value =
              field === "approxHeightM"
                ? (n % 880_000) / 100
                : field === "name"
                  ? `Load hut ${n}`
                  : `note ${n}`;
            const changed = await updateSiteLocally(t.db, campaignId, site.id, {
              [field]: value,
            });
            if (!changed) throw new Error(`edit ${n} changed nothing: values must be unique`);
            entry = { tablet: t.index, kind: "update", site: site.id, field, value };
          }
        }
        issued.push({ ...entry, mutationId: await t.lastMutationId() });
      }

      async function editLoop(t: LoadTablet): Promise<void> {
        const random = seededRandom(SEED + t.index);
        const maxSteps = Math.ceil((SECONDS * 1000) / (EDIT_MS * 0.3)) + 10;
        for (let step = 0; step < maxSteps && Date.now() < deadline; step += 1) {
          await sleep(EDIT_MS * (0.3 + random() * 1.4));
          if (Date.now() >= deadline) break;
          if (random() < OFFLINE_CHANCE) t.goOffline(500 + random() * (OFFLINE_MAX_MS - 500));
          await edit(t, random);
        }
      }

      async function timedSync(t: LoadTablet): Promise<boolean> {
        const t0 = performance.now();
        try {
          await t.engine.sync();
          syncMs.push(performance.now() - t0);
          return true;
        } catch {
          syncFailures += 1;
          return false;
        }
      }

      async function syncLoop(t: LoadTablet): Promise<void> {
        const random = seededRandom(SEED + 5000 + t.index);
        const maxSteps = Math.ceil((SECONDS * 1000) / (SYNC_MS * 0.3)) + 10;
        for (let step = 0; step < maxSteps && Date.now() < deadline; step += 1) {
          await sleep(SYNC_MS * (0.3 + random() * 1.4));
          if (Date.now() >= deadline) break;
          await timedSync(t);
        }
      }

      await Promise.all(tablets.flatMap((t) => [editLoop(t), syncLoop(t)]));
      const loadFailures = syncFailures;
      const loadSyncs = syncMs.length + loadFailures;
      const loadMs = [...syncMs];
      loopDelay.disable();

      // Settle: the link is healthy again; every tablet syncs until a round that began with every
      // outbox empty has succeeded everywhere (then nobody pushed during it, so all pulled the end).
      for (const t of tablets) t.setFaults(false);
      const settleDeadline = Date.now() + SETTLE_MS;
      let settleRounds = 0;
      let settled = false;
      while (!settled && settleRounds < 20 && Date.now() < settleDeadline) {
        const pendingBefore = (await Promise.all(tablets.map((t) => t.db.outbox.count()))).reduce(
          (a, b) => a + b,
          0,
        );
        const ok = await Promise.all(tablets.map(timedSync));
        settleRounds += 1;
        settled = pendingBefore === 0 && ok.every(Boolean);
      }
      const elapsedS = (Date.now() - started) / 1000;
      expect(settled, "every tablet caught up within the settle budget").toBe(true);

      // What the server holds, straight from PostgreSQL.
      const serverSites = (
        await database.db.select().from(sites).where(eq(sites.campaignId, campaignId))
      )
        .map(presentSite)
        .sort((a, b) => (a.id < b.id ? -1 : 1));
      const serverConflicts = (
        await database.db.select().from(conflicts).where(eq(conflicts.campaignId, campaignId))
      )
        .map((c) => ({ ...presentConflict(c), campaignId }))
        .sort((a, b) => (a.id < b.id ? -1 : 1));
      const audit = await database.db
        .select()
        .from(auditEvents)
        .where(eq(auditEvents.campaignId, campaignId));
      const rejections = await database.db
        .select()
        .from(syncRejections)
        .where(eq(syncRejections.campaignId, campaignId));
      const clientIds = await Promise.all(tablets.map((t) => t.clientId()));
      const positions = await database.db
        .select()
        .from(syncClients)
        .where(inArray(syncClients.id, clientIds));

      // Every tablet holds exactly the server's sites and conflicts; nothing waits in an outbox.
      for (const t of tablets) {
        const view = (await t.db.sites.where("campaignId").equals(campaignId).sortBy("id")).map(
          ({ pendingChanges: _p, ...s }) => s,
        );
        expect(view, `tablet ${t.index} sites`).toEqual(serverSites);
        const seen = await t.db.conflicts.where("campaignId").equals(campaignId).sortBy("id");
        expect(seen, `tablet ${t.index} conflicts`).toEqual(serverConflicts);
        expect(await t.db.outbox.count(), `tablet ${t.index} outbox`).toBe(0);
      }
      // The API lists the same live sites.
      const listed = await fetch(`${server.url}/api/campaigns/${campaignId}/sites`, {
        headers: { authorization: `Bearer ${tokens.get("admin")}` },
      });
      expect(listed.status).toBe(200);
      const listedIds = ((await listed.json()) as { sites: { id: string }[] }).sites
        .map((s) => s.id)
        .sort();
      expect(listedIds).toEqual(serverSites.filter((s) => !s.deletedAt).map((s) => s.id));

      // Nothing lost, nothing twice: the server's position for each tablet is its last mutation,
      // and of all the answers the server sent (lost ones too) each mutation got exactly one that
      // was not "duplicate".
      const problems: string[] = [];
      const outcome = new Map<string, MutationResult>();
      for (const [i, t] of tablets.entries()) {
        const last = await t.lastMutationId();
        const mine = issued.filter((e) => e.tablet === t.index);
        if (mine.length !== last) problems.push(`tablet ${i}: ${last} ids, ${mine.length} edits`);
        const position = positions.find((p) => p.id === clientIds[i])?.lastMutationId ?? 0;
        if (position !== last)
          problems.push(`tablet ${i}: server at ${position}, tablet at ${last}`);
        for (let id = 1; id <= last; id += 1) {
          const fresh = (t.stats.results.get(id) ?? []).filter((r) => r.status !== "duplicate");
          if (fresh.length !== 1)
            problems.push(`tablet ${i} mutation ${id}: applied ${fresh.length} times`);
          if (fresh[0]) outcome.set(`${i}:${id}`, fresh[0]);
        }
      }
      const fieldOf = (record: unknown, field: Field | undefined) =>
        (record as Record<string, unknown> | null)?.[field ?? ""];
      // Each outcome left its one trace (for an edit: the one audit row that set its value): an audit row, a conflict record or a kept refusal.
      const auditCount = (match: (a: (typeof audit)[number]) => boolean) =>
        audit.filter(match).length;
      const serverById = new Map(serverSites.map((s) => [s.id, s]));
      let applied = 0;
      let conflicted = 0;
      let refused = 0;
      let deletesApplied = 0;
      for (const e of issued) {
        const result = outcome.get(`${e.tablet}:${e.mutationId}`);
        const t = tablets[e.tablet];
        if (!result || !t) continue;
        const clientId = clientIds[e.tablet];
        const label = `tablet ${e.tablet} mutation ${e.mutationId} (${e.kind})`;
        if (result.status === "rejected") {
          refused += 1;
          const kept = rejections.filter(
            (r) => r.clientId === clientId && r.mutationId === e.mutationId,
          ).length;
          const recovered = await t.db.recovery
            .filter((r) => r.mutationId === e.mutationId)
            .count();
          if (kept !== 1 || recovered !== 1)
            problems.push(`${label}: refused, ${kept} server records, ${recovered} on the tablet`);
        } else if (result.status === "conflict") {
          conflicted += 1;
          const records = serverConflicts.filter(
            (c) => c.entityId === e.site && c.field === e.field && c.clientValue === e.value,
          ).length;
          if (records !== 1) problems.push(`${label}: conflict, ${records} conflict records`);
        } else {
          applied += 1;
          const site = serverById.get(e.site);
          if (e.kind === "create") {
            const rows = auditCount((a) => a.entityId === e.site && a.action === "create");
            if (!site || rows !== 1) problems.push(`${label}: ${rows} create audit rows`);
          } else if (e.kind === "delete") {
            if (!site?.deletedAt) problems.push(`${label}: the site is not deleted`);
            if (result.message !== "Already deleted") deletesApplied += 1;
          } else {
            const rows = auditCount(
              (a) =>
                a.entityId === e.site &&
                a.action === "update" &&
                a.clientId === clientId &&
                fieldOf(a.after, e.field) === e.value &&
                fieldOf(a.before, e.field) !== e.value,
            );
            if (rows !== 1) problems.push(`${label}: ${rows} audit rows with its value`);
          }
        }
      }
      // No extra traces either: the server wrote exactly one row per outcome.
      const updatesApplied = issued.filter(
        (e) =>
          e.kind === "update" && outcome.get(`${e.tablet}:${e.mutationId}`)?.status === "applied",
      ).length;
      if (auditCount((a) => a.action === "update") !== updatesApplied)
        problems.push(
          `update audit rows ${auditCount((a) => a.action === "update")}, applied ${updatesApplied}`,
        );
      if (auditCount((a) => a.action === "delete") !== deletesApplied)
        problems.push(
          `delete audit rows ${auditCount((a) => a.action === "delete")}, applied ${deletesApplied}`,
        );
      if (serverConflicts.length !== conflicted)
        problems.push(`${serverConflicts.length} conflict records for ${conflicted} conflicts`);
      if (rejections.length !== refused)
        problems.push(`${rejections.length} kept refusals for ${refused} refused`);
      const recoveries = await Promise.all(tablets.map((t) => t.db.recovery.count()));
      if (recoveries.reduce((a, b) => a + b, 0) !== refused)
        problems.push(`recovery holds ${recoveries.join("+")}, ${refused} refused`);
      expect(problems).toEqual([]);

      // The run really exercised what it claims to.
      const sum = (pick: (t: LoadTablet) => number) => tablets.reduce((a, t) => a + pick(t), 0);
      const deadlocks = await database.pool.query<{ deadlocks: string }>(
        "select deadlocks from pg_stat_database where datname = current_database()",
      );
      const figures = {
        tablets: TABLETS,
        seconds: SECONDS,
        seed: SEED,
        elapsedS: Math.round(elapsedS),
        mutations: issued.length,
        creates: issued.filter((e) => e.kind === "create").length,
        updates: issued.filter((e) => e.kind === "update").length,
        deletes: issued.filter((e) => e.kind === "delete").length,
        applied,
        conflicts: conflicted,
        refused,
        mutationsSent: sum((t) => t.stats.mutationsSent),
        duplicateAnswers: sum((t) =>
          [...t.stats.results.values()].reduce(
            (a, rs) => a + rs.filter((r) => r.status === "duplicate").length,
            0,
          ),
        ),
        pushes: sum((t) => t.stats.pushes),
        pulls: sum((t) => t.stats.pulls),
        syncRounds: loadSyncs,
        syncFailures: loadFailures,
        syncMsP50: Math.round(quantile(loadMs, 0.5)),
        syncMsP99: Math.round(quantile(loadMs, 0.99)),
        syncMsMax: Math.round(quantile(loadMs, 1)),
        pushMsP99: Math.round(
          quantile(
            tablets.flatMap((t) => t.stats.pushMs),
            0.99,
          ),
        ),
        pullMsP99: Math.round(
          quantile(
            tablets.flatMap((t) => t.stats.pullMs),
            0.99,
          ),
        ),
        eventLoopDelayMsP99: Math.round(loopDelay.percentile(99) / 1e6),
        settleRounds,
        disconnects: {
          refused: sum((t) => t.stats.refused),
          answersLost: sum((t) => t.stats.answersLost),
          offlineStretches: sum((t) => t.stats.offlineStretches),
          refusedWhileOffline: sum((t) => t.stats.refusedOffline),
        },
        refusedFor: Object.fromEntries(
          [...new Set(rejections.map((r) => r.reason))].map((reason) => [
            reason,
            rejections.filter((r) => r.reason === reason).length,
          ]),
        ),
        serverErrors: sum((t) => t.stats.serverErrors),
        deadlocks: Number(deadlocks.rows[0]?.deadlocks ?? 0),
        sites: serverSites.length,
      };
      console.log(`sync-load figures: ${JSON.stringify(figures)}`);
      const dir = resolve("test-artifacts", "reliability");
      mkdirSync(dir, { recursive: true });
      writeFileSync(resolve(dir, "sync-load.json"), `${JSON.stringify(figures, null, 2)}\n`);

      expect(figures.mutations).toBeGreaterThan(TABLETS * 5);
      expect(figures.conflicts).toBeGreaterThan(0);
      expect(figures.disconnects.answersLost).toBeGreaterThan(0);
      expect(figures.disconnects.refused).toBeGreaterThan(0);
      expect(figures.duplicateAnswers).toBeGreaterThan(0);
      // Writers of a campaign take its counter lock first, so they queue and never deadlock.
      expect({ deadlocks: figures.deadlocks, serverErrors: figures.serverErrors }).toEqual({
        deadlocks: 0,
        serverErrors: 0,
      });
    },
    SECONDS * 1000 + SETTLE_MS + 60_000,
  );
});
