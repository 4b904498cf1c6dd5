// The client side: a tablet's Dexie database on fake-indexeddb, and the engine's HTTP transport
// over a small fetch-based request function (JSON, bearer token, zod-checked answers).
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import type { z } from "zod";
import { demoPassword } from "../../server/seed/demo";
import { openDatabase, type EquipotDb } from "../../src/db/database";
import { ApiError } from "../../src/lib/api-error";
import { createHttpTransport } from "../../src/sync/http-transport";
import type { SyncTransport } from "../../src/sync/transport";

export interface Session {
  token: string;
  campaignIds: string[];
}

export async function signIn(baseUrl: string, email: string): Promise<Session> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json", "x-equipot-request": "1" },
    body: JSON.stringify({ email, password: demoPassword }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email} failed: ${res.status} ${await res.text()}`);
  const body = (await res.json()) as { accessToken: string; memberships: { campaignId: string }[] };
  return { token: body.accessToken, campaignIds: body.memberships.map((m) => m.campaignId) };
}

export function httpTransport(baseUrl: string, token: string): SyncTransport {
  return createHttpTransport(
    async <S extends z.ZodType>(
      path: string,
      options: { method?: "GET" | "POST"; body?: unknown; schema: S },
    ) => {
      let res: Response;
      try {
        res = await fetch(`${baseUrl}/api${path}`, {
          method: options.method ?? "GET",
          headers: { "content-type": "application/json", authorization: `Bearer ${token}` },
          body: options.body === undefined ? undefined : JSON.stringify(options.body),
        });
      } catch (cause) {
        throw ApiError.network(cause);
      }
      const body = (await res.json()) as { error?: { code: "internal"; message: string } };
      if (!res.ok)
        throw new ApiError(res.status, body.error?.code ?? "internal", body.error?.message ?? "");
      return options.schema.parse(body) as z.output<S>;
    },
  );
}

/** A new tablet: its own IndexedDB factory, so nothing is shared with earlier rounds. */
export const openClient = (): EquipotDb =>
  openDatabase(`bench-${crypto.randomUUID()}`, { indexedDB: new IDBFactory(), IDBKeyRange });

export interface ClientSnapshot {
  tables: Record<string, unknown[]>;
}

/** Every row of every table, to give later rounds the same queued outbox without queuing again. */
export async function snapshot(db: EquipotDb): Promise<ClientSnapshot> {
  const tables: Record<string, unknown[]> = {};
  for (const table of db.tables) tables[table.name] = await table.toArray();
  return { tables };
}

export async function restore(db: EquipotDb, from: ClientSnapshot): Promise<void> {
  await db.transaction("rw", db.tables, async () => {
    for (const table of db.tables) await table.bulkAdd(from.tables[table.name] ?? []);
  });
}
