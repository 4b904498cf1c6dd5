// Alerts: an entry judged beyond its crate's limits raises one alert, pulled by every tablet of the
// campaign, and queues one e-mail per alert recipient, all in the caller's transaction, so the
// entry, its alert and its e-mails are stored together or not at all.
//
// The alert recipients are the campaign's logistics members (role logistics, account not
// disabled): they own the crates and their movements. Administrators are not e-mailed; they see
// the alert in the app. Recipients are fixed when the alert is raised.
import { fieldEntryKindLabels, type FieldEntryKind } from "../../shared/schemas/field-entries";
import { nextChangeSeq } from "../db/change-seq";
import type { Tx } from "../db/client";
import {
  alertPlaceNames,
  alertRecipients,
  findAlertOfEntry,
  insertAlertOnce,
  type AlertRow,
} from "../db/repositories/alerts";
import { enqueueEmailOnce, type OutgoingEmail } from "../db/repositories/outbox";

export interface AlertingEntry {
  id: string;
  campaignId: string;
  siteId: string;
  crateId: string | null;
  kind: FieldEntryKind;
  observedAt: Date;
  summary: string;
}

export interface AlertMailFacts {
  campaignId: string;
  campaignName: string;
  siteName: string;
  crateLabel: string | null;
  kind: FieldEntryKind;
  summary: string;
  observedAt: Date;
  recordedByName: string | null;
  /** The public address of the app; without it the link is given as a path. */
  linkBase: string | undefined;
}

/** `2027-06-04 08:00 UTC`: one unambiguous time for readers in any zone. */
export const utcMinute = (at: Date) => `${at.toISOString().slice(0, 16).replace("T", " ")} UTC`;

export const alertsLink = (linkBase: string | undefined, campaignId: string) =>
  `${(linkBase ?? "").replace(/\/$/, "")}/campaigns/${campaignId}/alerts`;

/** The e-mail of one alert, plain text. */
export function alertEmail(facts: AlertMailFacts): Omit<OutgoingEmail, "toAddress"> {
  const crate = facts.crateLabel ? `crate ${facts.crateLabel}` : "no crate named";
  return {
    subject: `Equipot alert, ${facts.campaignName}: ${crate} at ${facts.siteName}: ${facts.summary}`,
    textBody: [
      `An entry in the campaign "${facts.campaignName}" is beyond its crate's limits.`,
      "",
      `Crate:       ${facts.crateLabel ?? "none named"}`,
      `Site:        ${facts.siteName}`,
      `Entry:       ${fieldEntryKindLabels[facts.kind]}`,
      `Finding:     ${facts.summary}`,
      `Observed:    ${utcMinute(facts.observedAt)}`,
      `Recorded by: ${facts.recordedByName ?? "unknown"}`,
      "",
      "See and acknowledge the alert in Equipot:",
      alertsLink(facts.linkBase, facts.campaignId),
      "",
      "Equipot alerts do not replace the carrier's or the site's own procedures: follow those for",
      "inspecting, reporting and handling the crate.",
    ].join("\n"),
  };
}

export interface RaisedAlert {
  alert: AlertRow;
  /** False when the entry already had its alert: nothing new was queued. */
  created: boolean;
  queued: number;
}

/**
 * Raises the alert of an exceeded entry (at most one per entry) and queues its e-mails with the
 * message key `alert:<alertId>:<userId>`, so a retry never queues one twice.
 */
export async function raiseAlertForEntry(
  tx: Tx,
  input: {
    entry: AlertingEntry;
    crateLabel: string | null;
    recordedByName: string | null;
    linkBase: string | undefined;
  },
): Promise<RaisedAlert> {
  const { entry } = input;
  const existing = await findAlertOfEntry(tx, entry.id);
  if (existing) return { alert: existing, created: false, queued: 0 };
  const alert = await insertAlertOnce(tx, {
    campaignId: entry.campaignId,
    crateId: entry.crateId,
    siteId: entry.siteId,
    entryId: entry.id,
    kind: entry.kind,
    summary: entry.summary,
    changeSeq: await nextChangeSeq(tx, entry.campaignId),
  });
  // Raced by another transaction for the same entry: that one queues the e-mails.
  if (!alert) {
    const raced = await findAlertOfEntry(tx, entry.id);
    if (!raced) throw new Error(`alert of entry ${entry.id} neither inserted nor found`);
    return { alert: raced, created: false, queued: 0 };
  }
  const names = await alertPlaceNames(tx, entry.campaignId, entry.siteId);
  const mail = alertEmail({
    campaignId: entry.campaignId,
    campaignName: names?.campaignName ?? "(unknown campaign)",
    siteName: names?.siteName ?? "(unknown site)",
    crateLabel: input.crateLabel,
    kind: entry.kind,
    summary: entry.summary,
    observedAt: entry.observedAt,
    recordedByName: input.recordedByName,
    linkBase: input.linkBase,
  });
  let queued = 0;
  for (const recipient of await alertRecipients(tx, entry.campaignId)) {
    const fresh = await enqueueEmailOnce(tx, {
      ...mail,
      toAddress: recipient.email,
      messageKey: `alert:${alert.id}:${recipient.id}`,
    });
    if (fresh) queued += 1;
  }
  return { alert, created: true, queued };
}
