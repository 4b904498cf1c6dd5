// The campaign archive, built in memory (bounded by archiveLimits.exportBytes): campaign.json,
// one CSV per table, the attachment bytes, one CSV per series file and a README.
import { zipSync, strToU8, type Zippable } from "fflate";
import type { Readable } from "node:stream";
import {
  archiveFormat,
  archiveLimits,
  archiveTables,
  type ArchiveTable,
} from "../../../shared/schemas/campaign-archive";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import type { Db, Tx } from "../../db/client";
import {
  estimateArchiveBytes,
  readCampaign,
  readChunksOfFile,
  readTableRows,
  readUserNames,
  withExportSnapshot,
  type JsonRow,
} from "../../db/repositories/campaign-export";
import { HttpError, unavailable } from "../../http-errors";
import { attachmentKey, type Storage } from "../../storage/storage";
import { tableCsv, userIdsOf } from "./csv";
import { archiveReadme } from "./archive-readme";
import { seriesCsv } from "./series-csv";

export interface ExportDeps {
  db: Db;
  storage: Storage;
}

export type Tables = ReadonlyMap<ArchiveTable, JsonRow[]>;
export const rowsOf = (tables: Tables, table: ArchiveTable) => tables.get(table) ?? [];

async function readAllTables(tx: Tx, campaignId: string): Promise<Tables> {
  const tables = new Map<ArchiveTable, JsonRow[]>();
  // One snapshot, one connection: the reads run one after another.
  for (const table of archiveTables) tables.set(table, await readTableRows(tx, campaignId, table));
  return tables;
}

async function readSnapshot(db: Db, campaignId: string) {
  return withExportSnapshot(db, async (tx) => {
    const bytes = await estimateArchiveBytes(tx, campaignId);
    if (bytes > archiveLimits.exportBytes) {
      const mb = (n: number) => Math.ceil(n / 1024 / 1024);
      throw new HttpError(
        413,
        "payload_too_large",
        `This campaign holds about ${mb(bytes)} MB of files and series, more than one archive takes (${mb(archiveLimits.exportBytes)} MB). Export the tables as CSV instead.`,
      );
    }
    const campaign = await readCampaign(tx, campaignId);
    const tables = await readAllTables(tx, campaignId);
    const chunks: JsonRow[] = [];
    for (const file of rowsOf(tables, "comparison_files"))
      chunks.push(...(await readChunksOfFile(tx, campaignId, String(file.id))));
    const everyone = archiveTables.flatMap((t) => userIdsOf(rowsOf(tables, t)));
    const names = await readUserNames(tx, [...new Set(everyone)]);
    return { campaign, tables, chunks, names };
  });
}

async function readBytes(stream: Readable): Promise<Uint8Array> {
  const parts: Buffer[] = [];
  for await (const part of stream) parts.push(Buffer.isBuffer(part) ? part : Buffer.from(part));
  return Buffer.concat(parts);
}

async function readAttachments(storage: Storage, campaignId: string, rows: JsonRow[]) {
  const files: Zippable = {};
  for (const row of rows) {
    const sha256 = String(row.sha256);
    const object = await storage.get(attachmentKey(campaignId, sha256)).catch(() => undefined);
    if (!object) throw unavailable(`The bytes of attachment ${sha256} are missing from storage`);
    // Photos and PDFs are compressed already: stored as they are.
    files[`attachments/${sha256}`] = [await readBytes(object.stream), { level: 0 }];
  }
  return files;
}

export async function buildArchive(deps: ExportDeps, campaignId: string, now: Date) {
  const { campaign, tables, chunks, names } = await readSnapshot(deps.db, campaignId);
  const attachmentFiles = await readAttachments(
    deps.storage,
    campaignId,
    rowsOf(tables, "attachments"),
  );
  const document = {
    format: archiveFormat.name,
    formatVersion: archiveFormat.version,
    exportedAt: now.toISOString(),
    caution: officialHeightsCaution,
    source: {
      campaignId: campaign.id,
      campaignName: campaign.name,
      description: campaign.description,
    },
    users: [...names].map(([id, name]) => ({ id, name })),
    tables: Object.fromEntries(tables),
    comparison_chunks: chunks,
  };
  const files: Zippable = {
    "README.txt": strToU8(archiveReadme(document.source.campaignName, now, tables)),
    "campaign.json": strToU8(JSON.stringify(document)),
    ...attachmentFiles,
  };
  for (const table of archiveTables)
    files[`tables/${table}.csv`] = strToU8(tableCsv(table, rowsOf(tables, table), names));
  for (const file of rowsOf(tables, "comparison_files")) {
    const id = String(file.id);
    files[`series/${id}.csv`] = strToU8(seriesCsv(chunks.filter((c) => c.file_id === id)));
  }
  return { zip: zipSync(files, { level: 6 }), campaignName: campaign.name };
}
