// How each archive table is read, ordered and tied to the others. Table and column names here are
// constants of this file: nothing from a request or an archive is ever spliced into SQL.
import type { ArchiveTable } from "../../../shared/schemas/campaign-archive";

export interface TableSpec {
  /** ORDER BY over the alias t: the archive keeps rows in this order and the import keeps it. */
  orderBy: string;
  /** Columns left out of the archive: implied (campaign_id), global serials, storage internals. */
  omit: readonly string[];
  /** Columns that name a record of another archive table (checked, then rewritten on import). */
  refs: Readonly<Record<string, ArchiveTable>>;
}

const bySeq = "t.change_seq, t.id";
const campaignOnly = ["campaign_id"] as const;

export const tableSpecs: Record<ArchiveTable, TableSpec> = {
  sites: { orderBy: bySeq, omit: campaignOnly, refs: {} },
  crates: { orderBy: bySeq, omit: campaignOnly, refs: {} },
  benchmarks: { orderBy: bySeq, omit: campaignOnly, refs: {} },
  checklist_templates: { orderBy: bySeq, omit: campaignOnly, refs: {} },
  checklist_runs: {
    orderBy: bySeq,
    omit: campaignOnly,
    refs: { template_id: "checklist_templates", site_id: "sites" },
  },
  checklist_results: { orderBy: bySeq, omit: campaignOnly, refs: { run_id: "checklist_runs" } },
  field_entries: {
    orderBy: bySeq,
    omit: campaignOnly,
    refs: { site_id: "sites", crate_id: "crates" },
  },
  levelling_sections: { orderBy: bySeq, omit: campaignOnly, refs: { site_id: "sites" } },
  levelling_setups: {
    orderBy: bySeq,
    omit: campaignOnly,
    refs: { section_id: "levelling_sections" },
  },
  legs: {
    orderBy: bySeq,
    omit: campaignOnly,
    refs: { crate_id: "crates", from_site_id: "sites", to_site_id: "sites" },
  },
  handovers: {
    orderBy: bySeq,
    omit: campaignOnly,
    refs: { crate_id: "crates", leg_id: "legs", site_id: "sites" },
  },
  alerts: {
    orderBy: bySeq,
    omit: campaignOnly,
    refs: { crate_id: "crates", site_id: "sites", entry_id: "field_entries" },
  },
  instruments: { orderBy: "t.updated_at, t.id", omit: campaignOnly, refs: {} },
  height_ties: { orderBy: "t.created_at, t.id", omit: campaignOnly, refs: {} },
  levelling_adjustments: { orderBy: "t.created_at, t.id", omit: campaignOnly, refs: {} },
  comparison_runs: {
    orderBy: "t.created_at, t.id",
    omit: campaignOnly,
    refs: {
      remote_site_id: "sites",
      remote_clock_id: "instruments",
      reference_clock_id: "instruments",
      link_id: "instruments",
    },
  },
  comparison_files: {
    orderBy: "t.created_at, t.id",
    omit: campaignOnly,
    refs: { run_id: "comparison_runs" },
  },
  attachments: {
    orderBy: "t.created_at, t.sha256",
    omit: ["campaign_id", "storage_key"],
    refs: {},
  },
  attachment_links: { orderBy: bySeq, omit: campaignOnly, refs: {} },
  entry_reviews: { orderBy: bySeq, omit: campaignOnly, refs: {} },
  audit_events: { orderBy: "t.id", omit: ["campaign_id", "id"], refs: {} },
};

/** The table a polymorphic subject (attachment link, review decision) names by its kind. */
export const subjectTables: Readonly<Record<string, ArchiveTable>> = {
  site: "sites",
  checklistRun: "checklist_runs",
  fieldEntry: "field_entries",
  levellingSection: "levelling_sections",
  leg: "legs",
  handover: "handovers",
};

/** Columns that name a person: kept on import when the account exists here, else null. */
export const isUserColumn = (column: string) => column === "user_id" || column.endsWith("_by");
