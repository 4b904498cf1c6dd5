// The campaign archive (archive.zip): campaign.json holds every record of a campaign, beside one
// CSV per table, the attachment bytes under attachments/<sha256>, series CSVs and a README.
import { z } from "zod";
import { roles } from "../permissions";
import { archiveRowSchemas, archiveTables, type ArchiveTable } from "./campaign-archive-rows";
import { limits } from "./limits";

export {
  archiveRowSchemas,
  archiveTable,
  archiveTables,
  heightTables,
  type ArchiveRow,
  type ArchiveTable,
} from "./campaign-archive-rows";

export const archiveFormat = { name: "equipot-campaign-archive", version: 1 } as const;

/** Size bounds: the archive is built and read in memory, so both sides stop well before memory does. */
export const archiveLimits = {
  /** The ZIP as sent to the import. */
  zipBytes: 256 * 1024 * 1024,
  /** The sum of the decompressed files inside it, as their headers declare. */
  contentBytes: 768 * 1024 * 1024,
  /** Attachment bytes plus series samples (16 bytes each) that one export will gather. */
  exportBytes: 256 * 1024 * 1024,
} as const;

const id = z.uuid();
/** A sample flagged invalid is NaN in the database, which PostgreSQL's JSON writes as "NaN". */
const sample = z.union([
  z.number(),
  z.literal("NaN"),
  z.literal("Infinity"),
  z.literal("-Infinity"),
]);

export const archiveChunk = z.strictObject({
  file_id: id,
  chunk_no: z.number().int().nonnegative(),
  times: z.array(z.number()),
  values: z.array(sample),
});
export type ArchiveChunk = z.infer<typeof archiveChunk>;

const rows = <T extends ArchiveTable>(t: T) => z.array(archiveRowSchemas[t]);

const archiveTableSet = z.strictObject({
  sites: rows("sites"),
  crates: rows("crates"),
  benchmarks: rows("benchmarks"),
  checklist_templates: rows("checklist_templates"),
  checklist_runs: rows("checklist_runs"),
  checklist_results: rows("checklist_results"),
  field_entries: rows("field_entries"),
  levelling_sections: rows("levelling_sections"),
  levelling_setups: rows("levelling_setups"),
  legs: rows("legs"),
  handovers: rows("handovers"),
  alerts: rows("alerts"),
  instruments: rows("instruments"),
  height_ties: rows("height_ties"),
  levelling_adjustments: rows("levelling_adjustments"),
  comparison_runs: rows("comparison_runs"),
  comparison_files: rows("comparison_files"),
  attachments: rows("attachments"),
  attachment_links: rows("attachment_links"),
  entry_reviews: rows("entry_reviews"),
  audit_events: rows("audit_events"),
}) satisfies z.ZodType<Record<(typeof archiveTables)[number], unknown[]>>;
export type ArchiveTableSet = z.infer<typeof archiveTableSet>;

export const campaignArchive = z.strictObject({
  format: z.literal(archiveFormat.name),
  formatVersion: z.literal(archiveFormat.version),
  exportedAt: z.iso.datetime({ offset: true }),
  caution: z.string(),
  source: z.strictObject({
    /** The source campaign's id: references to it inside JSON values are rewritten on import. */
    campaignId: id,
    campaignName: z.string().max(limits.campaignNameMax),
    description: z.string(),
  }),
  /** Everyone the records name, so that names can be read where the account does not exist. */
  users: z.array(z.strictObject({ id, name: z.string() })),
  tables: archiveTableSet,
  comparison_chunks: z.array(archiveChunk),
});
export type CampaignArchive = z.infer<typeof campaignArchive>;

export const archiveImportQuery = z.strictObject({
  name: z.string().trim().min(1, "Give the new campaign a name").max(limits.campaignNameMax),
});

export const archiveImportResult = z.object({
  campaign: z.object({ id, name: z.string(), role: z.enum(roles) }),
  counts: z.record(z.string(), z.number().int()),
});
export type ArchiveImportResult = z.infer<typeof archiveImportResult>;
