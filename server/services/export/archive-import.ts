// An archive becomes a NEW campaign: every record's id is replaced by a fresh uuid (ids are global
// keys, so the source campaign on this server would collide) and every reference, inside JSON
// values too, follows the same map. Change positions are taken fresh, in the original order.
import { randomUUID } from "node:crypto";
import {
  archiveRowSchemas,
  archiveTables,
  type ArchiveImportResult,
  type ArchiveTable,
  type CampaignArchive,
} from "../../../shared/schemas/campaign-archive";
import { takeChangeSeqs } from "../../db/change-seq";
import type { Tx } from "../../db/client";
import { isUserColumn } from "../../db/repositories/archive-spec";
import { recordAudit } from "../../db/repositories/audit";
import {
  existingUserIds,
  insertCampaignWithAdmin,
  insertRows,
  type ImportTable,
} from "../../db/repositories/campaign-import";
import { asSystem } from "../../db/scope";
import { attachmentKey } from "../../storage/storage";
import type { ExportDeps } from "./archive-build";
import { checkAttachmentTypes, readArchive, refuse, type ReadArchive } from "./archive-read";

type Row = Record<string, unknown>;

interface RemapContext {
  ids: ReadonlyMap<string, string>;
  users: ReadonlySet<string>;
  seq: (old: number) => number;
}

function remapDeep(value: unknown, ids: ReadonlyMap<string, string>): unknown {
  if (typeof value === "string") return ids.get(value) ?? value;
  if (Array.isArray(value)) return value.map((v) => remapDeep(v, ids));
  if (value !== null && typeof value === "object")
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, remapDeep(v, ids)]));
  return value;
}

function remapRow(row: Row, ctx: RemapContext): Row {
  const out: Row = {};
  for (const [column, value] of Object.entries(row)) {
    if (isUserColumn(column))
      out[column] = typeof value === "string" && ctx.users.has(value) ? value : null;
    else if ((column === "change_seq" || column === "reviewed_seq") && typeof value === "number")
      out[column] = ctx.seq(value);
    else out[column] = remapDeep(value, ctx.ids);
  }
  return out;
}

const rowsOf = (archive: CampaignArchive, table: ArchiveTable): readonly Row[] =>
  archive.tables[table];

function idMapOf(archive: CampaignArchive, campaignId: string): Map<string, string> {
  const ids = new Map([[archive.source.campaignId, campaignId]]);
  for (const table of archiveTables)
    for (const row of rowsOf(archive, table))
      if (typeof row.id === "string") ids.set(row.id, randomUUID());
  return ids;
}

/**
 * Fresh positions for the distinct old ones, in order. A position that names no row (a review's
 * `reviewed_seq` can) maps to the last new position at or before it, so every comparison between
 * positions comes out as it did in the source.
 */
async function seqMapOf(tx: Tx, campaignId: string, archive: CampaignArchive) {
  const old = new Set<number>();
  for (const table of archiveTables)
    for (const row of rowsOf(archive, table))
      if (typeof row.change_seq === "number") old.add(row.change_seq);
  const sorted = [...old].sort((a, b) => a - b);
  const first = sorted.length > 0 ? await takeChangeSeqs(tx, campaignId, sorted.length) : 1;
  return (x: number) => {
    let lo = 0;
    let hi = sorted.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((sorted[mid] ?? 0) <= x) lo = mid + 1;
      else hi = mid;
    }
    return first - 1 + lo;
  };
}

function userIdsIn(archive: CampaignArchive): string[] {
  const ids = new Set<string>();
  for (const table of archiveTables)
    for (const row of rowsOf(archive, table))
      for (const [column, value] of Object.entries(row))
        if (isUserColumn(column) && typeof value === "string") ids.add(value);
  return [...ids];
}

async function writeTables(
  tx: Tx,
  campaignId: string,
  archive: CampaignArchive,
  ctx: RemapContext,
) {
  const counts: Record<string, number> = {};
  for (const table of archiveTables) {
    const extra = (row: Row): Row =>
      table === "attachments"
        ? { ...row, storage_key: attachmentKey(campaignId, String(row.sha256)) }
        : row;
    const rows = rowsOf(archive, table).map((r) =>
      extra({ ...remapRow(r, ctx), campaign_id: campaignId }),
    );
    const columns = [...Object.keys(archiveRowSchemas[table].shape), "campaign_id"];
    if (table === "attachments") columns.push("storage_key");
    await insertNamed(tx, table, columns, rows);
    counts[table] = rows.length;
  }
  const chunks = archive.comparison_chunks.map((c) => remapRow(c, ctx));
  await insertNamed(tx, "comparison_chunks", ["file_id", "chunk_no", "times", "values"], chunks);
  counts.comparison_chunks = chunks.length;
  return counts;
}

/** A row the database refuses (a constraint, a value out of range) is the archive's fault: 400. */
async function insertNamed(tx: Tx, table: ImportTable, columns: string[], rows: Row[]) {
  try {
    await insertRows(tx, table, columns, rows);
  } catch (err) {
    const cause: unknown = err instanceof Error && err.cause ? err.cause : err;
    const code = cause instanceof Error && "code" in cause ? String(cause.code) : "";
    if (!/^2[23]/.test(code)) throw err;
    throw refuse(
      `campaign.json: table ${table}: the database refused a row (${cause instanceof Error ? cause.message : code})`,
    );
  }
}

async function storeAttachments(deps: ExportDeps, campaignId: string, read: ReadArchive) {
  const keys: string[] = [];
  for (const row of read.archive.tables.attachments) {
    const bytes = read.attachments.get(row.sha256);
    if (!bytes) continue;
    const key = attachmentKey(campaignId, row.sha256);
    await deps.storage.put(key, Buffer.from(bytes), {
      contentType: row.content_type,
      sizeBytes: bytes.length,
    });
    keys.push(key);
  }
  return keys;
}

export async function importArchive(
  deps: ExportDeps,
  userId: string,
  name: string,
  zip: Uint8Array,
): Promise<ArchiveImportResult> {
  const read = readArchive(zip);
  await checkAttachmentTypes(read);
  const { archive } = read;
  const campaignId = randomUUID();
  // Bytes before rows, as for uploads: a row always has its object. The keys live under the new
  // campaign's id, so a refused import leaves nothing anyone can reach; they are removed anyway.
  const keys = await storeAttachments(deps, campaignId, read);
  try {
    // The new campaign has no members until its first rows are in: system work.
    const counts = await asSystem("importing an archive as a new campaign", () =>
      deps.db.transaction(async (tx) => {
        const description = archive.source.description;
        await insertCampaignWithAdmin(tx, { id: campaignId, name, description }, userId);
        const users = await existingUserIds(tx, userIdsIn(archive));
        const ctx = {
          ids: idMapOf(archive, campaignId),
          users,
          seq: await seqMapOf(tx, campaignId, archive),
        };
        const written = await writeTables(tx, campaignId, archive, ctx);
        await recordAudit(tx, {
          campaignId,
          userId,
          action: "import",
          entity: "campaign",
          entityId: campaignId,
          after: { name, exportedAt: archive.exportedAt, source: archive.source, counts: written },
        });
        return written;
      }),
    );
    return { campaign: { id: campaignId, name, role: "admin" }, counts };
  } catch (err) {
    await Promise.all(keys.map((key) => deps.storage.delete(key).catch(() => undefined)));
    throw err;
  }
}
