// Every in-app address, built in one place.
import type { ReviewSubjectKind } from "../../shared/schemas/reviews";

const campaign = (campaignId: string) => `/campaigns/${encodeURIComponent(campaignId)}`;

export const paths = {
  home: "/",
  signIn: "/sign-in",
  invite: (token: string) => `/invite/${encodeURIComponent(token)}`,
  campaigns: "/campaigns",
  campaign,
  sites: (campaignId: string) => `${campaign(campaignId)}/sites`,
  newSite: (campaignId: string) => `${campaign(campaignId)}/sites/new`,
  editSite: (campaignId: string, siteId: string) =>
    `${campaign(campaignId)}/sites/${encodeURIComponent(siteId)}/edit`,
  /** The crew's home at a site. */
  siteBoard: (campaignId: string, siteId: string) =>
    `${campaign(campaignId)}/sites/${encodeURIComponent(siteId)}`,
  /** The board of the site chosen on this device, or the choice of one. */
  board: (campaignId: string) => `${campaign(campaignId)}/board`,
  newEntry: (campaignId: string, siteId: string, kind: string, runId?: string) =>
    `${campaign(campaignId)}/sites/${encodeURIComponent(siteId)}/entries/new/${encodeURIComponent(kind)}${
      runId === undefined ? "" : `?run=${encodeURIComponent(runId)}`
    }`,
  entry: (campaignId: string, entryId: string) =>
    `${campaign(campaignId)}/entries/${encodeURIComponent(entryId)}`,
  levelling: (campaignId: string, siteId: string) =>
    `${campaign(campaignId)}/sites/${encodeURIComponent(siteId)}/levelling`,
  levellingSection: (campaignId: string, sectionId: string) =>
    `${campaign(campaignId)}/levelling/${encodeURIComponent(sectionId)}`,
  entryImport: (campaignId: string, siteId: string, kind: "shock-log" | "temperatures") =>
    `${campaign(campaignId)}/sites/${encodeURIComponent(siteId)}/import?kind=${kind}`,
  temperatures: (campaignId: string, siteId: string) =>
    `${campaign(campaignId)}/sites/${encodeURIComponent(siteId)}/temperatures`,
  checklistRun: (campaignId: string, runId: string) =>
    `${campaign(campaignId)}/checklists/${encodeURIComponent(runId)}`,
  members: (campaignId: string) => `${campaign(campaignId)}/members`,
  checklistTemplates: (campaignId: string) => `${campaign(campaignId)}/checklist-templates`,
  conflicts: (campaignId: string) => `${campaign(campaignId)}/conflicts`,
  map: (campaignId: string) => `${campaign(campaignId)}/map`,
  crateLabel: (campaignId: string, crateId: string) =>
    `${campaign(campaignId)}/crates/${encodeURIComponent(crateId)}/label`,
  crates: (campaignId: string) => `${campaign(campaignId)}/crates`,
  crate: (campaignId: string, crateId: string) =>
    `${campaign(campaignId)}/crates/${encodeURIComponent(crateId)}`,
  /** The handover form, with the crate chosen when one is given. */
  handover: (campaignId: string, crateId?: string) =>
    `${campaign(campaignId)}/crates/hand-over${
      crateId === undefined ? "" : `?crate=${encodeURIComponent(crateId)}`
    }`,
  handoverRecord: (campaignId: string, handoverId: string) =>
    `${campaign(campaignId)}/crates/handovers/${encodeURIComponent(handoverId)}`,
  alerts: (campaignId: string) => `${campaign(campaignId)}/crates/alerts`,
  logistics: (campaignId: string) => `${campaign(campaignId)}/logistics`,
  /** The geodesist's side: comparison runs, with benchmarks, instruments and the network beside. */
  heights: (campaignId: string) => `${campaign(campaignId)}/heights`,
  benchmarks: (campaignId: string) => `${campaign(campaignId)}/heights/benchmarks`,
  instruments: (campaignId: string) => `${campaign(campaignId)}/heights/instruments`,
  instrument: (campaignId: string, instrumentId: string) =>
    `${campaign(campaignId)}/heights/instruments/${encodeURIComponent(instrumentId)}`,
  heightNetwork: (campaignId: string) => `${campaign(campaignId)}/heights/network`,
  newRun: (campaignId: string) => `${campaign(campaignId)}/heights/runs/new`,
  run: (campaignId: string, runId: string) =>
    `${campaign(campaignId)}/heights/runs/${encodeURIComponent(runId)}`,
  editRun: (campaignId: string, runId: string) =>
    `${campaign(campaignId)}/heights/runs/${encodeURIComponent(runId)}/edit`,
  /** Office review: the queue of synced records. */
  review: (campaignId: string) => `${campaign(campaignId)}/review`,
  /** One record under review: its content, decisions and audit trail. */
  reviewRecord: (campaignId: string, kind: string, id: string) =>
    `${campaign(campaignId)}/review/${encodeURIComponent(kind)}/${encodeURIComponent(id)}`,
  /** Where a reviewed record opens in the field pages (legs: the crates, where each leg shows). */
  reviewSubject: (campaignId: string, kind: ReviewSubjectKind, id: string) => {
    const at: Record<ReviewSubjectKind, string> = {
      checklistRun: `checklists/${encodeURIComponent(id)}`,
      fieldEntry: `entries/${encodeURIComponent(id)}`,
      levellingSection: `levelling/${encodeURIComponent(id)}`,
      handover: `crates/handovers/${encodeURIComponent(id)}`,
      leg: "crates",
    };
    return `${campaign(campaignId)}/${at[kind]}`;
  },
  exports: (campaignId: string) => `${campaign(campaignId)}/exports`,
  report: (campaignId: string) => `${campaign(campaignId)}/report`,
  device: "/device",
} as const;
