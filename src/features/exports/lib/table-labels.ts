// What each exported table holds, in the words of the people who use it.
import type { ArchiveTable } from "../../../../shared/schemas/campaign-archive";

export const tableLabels: Record<ArchiveTable, { label: string; holds: string }> = {
  sites: { label: "Sites", holds: "Places of the campaign with their position" },
  crates: { label: "Crates", holds: "Transport crates, contents and limits" },
  benchmarks: { label: "Benchmarks", holds: "Marks with their published heights" },
  checklist_templates: { label: "Checklist templates", holds: "Items of each checklist" },
  checklist_runs: { label: "Checklist runs", holds: "Checklists worked through, with sign-off" },
  checklist_results: { label: "Checklist results", holds: "Every result as entered" },
  field_entries: { label: "Field entries", holds: "Shock, temperature, dew-point, notes" },
  levelling_sections: { label: "Levelling sections", holds: "Sections with their misclosure" },
  levelling_setups: { label: "Levelling setups", holds: "Backsight and foresight readings" },
  legs: { label: "Legs", holds: "Crate journeys: planned, departed, arrived" },
  handovers: { label: "Handovers", holds: "Chain of custody per crate" },
  alerts: { label: "Alerts", holds: "Limits exceeded and their acknowledgement" },
  instruments: { label: "Instruments", holds: "Clocks and links with their uncertainties" },
  height_ties: { label: "Height ties", holds: "Imported section height differences" },
  levelling_adjustments: {
    label: "Levelling adjustments",
    holds: "Summary of each adjustment (all details are in the archive)",
  },
  comparison_runs: { label: "Comparison runs", holds: "Clock comparisons and their targets" },
  comparison_files: {
    label: "Comparison files",
    holds: "Uploaded series files (the samples are in the archive)",
  },
  attachments: { label: "Files", holds: "Stored photos and files by checksum" },
  attachment_links: {
    label: "Attachment links",
    holds: "Which record each photo or file belongs to",
  },
  entry_reviews: { label: "Review decisions", holds: "Approvals, send-backs and reopenings" },
  audit_events: { label: "Audit trail", holds: "Who changed what, when, from which device" },
};
