// Reading an archive for import: unzip within bounds, campaign.json against the strict schema,
// every reference inside the archive, and every attachment's bytes against its SHA-256 name.
// Any problem refuses the whole archive with a message naming the file, table, row and field.
import { unzipSync } from "fflate";
import { isUtf8 } from "node:buffer";
import { createHash } from "node:crypto";
import {
  archiveLimits,
  archiveTables,
  campaignArchive,
  type CampaignArchive,
} from "../../../shared/schemas/campaign-archive";
import type { FieldIssue } from "../../../shared/schemas/errors";
import { tableSpecs, subjectTables } from "../../db/repositories/archive-spec";
import { HttpError } from "../../http-errors";
import { sniffContentType } from "../attachments-content";

export interface ReadArchive {
  archive: CampaignArchive;
  /** Attachment bytes by SHA-256, each checked against its name. */
  attachments: Map<string, Uint8Array>;
}

export const refuse = (message: string, details?: FieldIssue[]) =>
  new HttpError(400, "invalid_file", message, details);

const reason = (err: unknown) => (err instanceof Error ? err.message : String(err));

/** "tables.sites.2.latitude_deg" → "table sites, row 3, field latitude_deg". */
function describePath(path: readonly PropertyKey[]): string {
  const [first, table, row, ...rest] = path.map(String);
  if (first === "tables" && table !== undefined && row !== undefined) {
    const field = rest.length > 0 ? `, field ${rest.join(".")}` : "";
    return `table ${table}, row ${Number(row) + 1}${field}`;
  }
  if (first === "comparison_chunks" && table !== undefined)
    return `comparison_chunks, row ${Number(table) + 1}${row ? `, field ${[row, ...rest].join(".")}` : ""}`;
  return path.length > 0 ? `field ${path.map(String).join(".")}` : "the document";
}

function unzip(zip: Uint8Array): Record<string, Uint8Array> {
  let declared = 0;
  try {
    return unzipSync(zip, {
      filter: (file) => {
        declared += file.originalSize;
        if (declared > archiveLimits.contentBytes)
          throw refuse(`archive.zip: its contents exceed ${archiveLimits.contentBytes} bytes`);
        return !file.name.endsWith("/");
      },
    });
  } catch (err) {
    if (err instanceof HttpError) throw err;
    throw refuse(`archive.zip: not a readable ZIP file (${reason(err)})`);
  }
}

function parseDocument(files: Record<string, Uint8Array>): CampaignArchive {
  const bytes = files["campaign.json"];
  if (!bytes) throw refuse("archive.zip: campaign.json is missing");
  let json: unknown;
  try {
    json = JSON.parse(Buffer.from(bytes).toString("utf8"));
  } catch (err) {
    throw refuse(`campaign.json: not valid JSON (${reason(err)})`);
  }
  const parsed = campaignArchive.safeParse(json);
  if (parsed.success) return parsed.data;
  const details = parsed.error.issues.slice(0, 20).map((issue) => ({
    path: issue.path.map(String).join("."),
    message: `${describePath(issue.path)}: ${issue.message}`,
  }));
  const first = details[0]?.message ?? "does not match the archive format";
  const more =
    parsed.error.issues.length > 1 ? ` (and ${parsed.error.issues.length - 1} more)` : "";
  throw refuse(`campaign.json: ${first}${more}`, details);
}

type IdSets = Map<string, Set<string>>;

function collectIds(archive: CampaignArchive): IdSets {
  const sets: IdSets = new Map();
  const seen = new Set<string>();
  for (const table of archiveTables) {
    const ids = new Set<string>();
    archive.tables[table].forEach((row: Record<string, unknown>, i) => {
      const id = row.id;
      if (typeof id !== "string") return;
      if (seen.has(id))
        throw refuse(`campaign.json: table ${table}, row ${i + 1}, field id: ${id} appears twice`);
      seen.add(id);
      ids.add(id);
    });
    sets.set(table, ids);
  }
  return sets;
}

function checkReferences(archive: CampaignArchive, ids: IdSets): void {
  for (const table of archiveTables) {
    const { refs } = tableSpecs[table];
    archive.tables[table].forEach((row: Record<string, unknown>, i) => {
      const at = `campaign.json: table ${table}, row ${i + 1}, field`;
      for (const [column, target] of Object.entries(refs)) {
        const value = row[column];
        if (typeof value === "string" && !ids.get(target)?.has(value))
          throw refuse(`${at} ${column}: ${value} names no row of ${target} in the archive`);
      }
      const kind = row.subject_kind;
      const subject = row.subject_id;
      const target = typeof kind === "string" ? subjectTables[kind] : undefined;
      if (target && typeof subject === "string" && !ids.get(target)?.has(subject))
        throw refuse(`${at} subject_id: ${subject} names no row of ${target} in the archive`);
    });
  }
  const files = ids.get("comparison_files") ?? new Set<string>();
  const chunkKeys = new Set<string>();
  archive.comparison_chunks.forEach((chunk, i) => {
    const at = `campaign.json: comparison_chunks, row ${i + 1}`;
    if (!files.has(chunk.file_id))
      throw refuse(`${at}, field file_id: ${chunk.file_id} names no comparison file`);
    if (chunk.times.length !== chunk.values.length)
      throw refuse(`${at}: times and values differ in length`);
    const key = `${chunk.file_id}/${chunk.chunk_no}`;
    if (chunkKeys.has(key)) throw refuse(`${at}, field chunk_no: chunk ${key} appears twice`);
    chunkKeys.add(key);
  });
}

function checkAttachments(archive: CampaignArchive, files: Record<string, Uint8Array>) {
  const bytesBySha = new Map<string, Uint8Array>();
  archive.tables.attachments.forEach((row, i) => {
    const name = `attachments/${row.sha256}`;
    const bytes = files[name];
    const at = `campaign.json: table attachments, row ${i + 1}`;
    if (bytesBySha.has(row.sha256)) throw refuse(`${at}, field sha256: appears twice`);
    if (!bytes) throw refuse(`archive.zip: ${name} is missing (named by ${at})`);
    const actual = createHash("sha256").update(bytes).digest("hex");
    if (actual !== row.sha256)
      throw refuse(`archive.zip: ${name}: the bytes' SHA-256 is ${actual}, not the name`);
    if (bytes.length !== row.size_bytes)
      throw refuse(`${at}, field size_bytes: ${row.size_bytes}, but ${name} has ${bytes.length}`);
    bytesBySha.set(row.sha256, bytes);
  });
  for (const name of Object.keys(files)) {
    const sha = name.startsWith("attachments/") ? name.slice("attachments/".length) : null;
    if (sha !== null && !bytesBySha.has(sha))
      throw refuse(`archive.zip: ${name} is not listed in campaign.json's attachments`);
  }
  return bytesBySha;
}

export function readArchive(zip: Uint8Array): ReadArchive {
  const files = unzip(zip);
  const archive = parseDocument(files);
  checkReferences(archive, collectIds(archive));
  return { archive, attachments: checkAttachments(archive, files) };
}

/** The bytes must be what their row says, judged as an upload is: no HTML, SVG or scripts. */
export async function checkAttachmentTypes(read: ReadArchive): Promise<void> {
  for (const row of read.archive.tables.attachments) {
    const bytes = Buffer.from(read.attachments.get(row.sha256) ?? new Uint8Array());
    const name = `archive.zip: attachments/${row.sha256}`;
    const sample = {
      head: bytes.subarray(0, 64 * 1024),
      utf8Text: isUtf8(bytes) && !bytes.includes(0),
    };
    const declared = { type: row.content_type, name: row.original_name };
    const found = await sniffContentType(sample, declared).catch((err: unknown) => {
      throw refuse(`${name}: ${reason(err)}`);
    });
    if (found !== row.content_type)
      throw refuse(`${name}: the bytes are ${found}, but the row says ${row.content_type}`);
  }
}
