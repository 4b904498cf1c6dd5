// Reads of logistics for live queries and tests, and the summaries built from them (where a crate
// is, who holds it, what is overdue). The summaries are pure so the dashboard and tests share them.
import type { CrateView } from "../../shared/schemas/crates";
import { legState, type CrateState } from "../../shared/schemas/logistics";
import type { EquipotDb, LocalAlert, LocalHandover, LocalLeg } from "./database";

export async function findCrate(
  db: EquipotDb,
  campaignId: string,
  crateId: string,
): Promise<CrateView | null> {
  const crate = await db.crates.get(crateId);
  return crate && crate.campaignId === campaignId && crate.deletedAt === null ? crate : null;
}

const legOrder = (a: LocalLeg, b: LocalLeg) =>
  a.plannedDepartAt.localeCompare(b.plannedDepartAt) || a.id.localeCompare(b.id);

/** Every leg of the campaign, by planned departure. */
export async function listLegs(db: EquipotDb, campaignId: string): Promise<LocalLeg[]> {
  const all = await db.legs.where("campaignId").equals(campaignId).toArray();
  return all.sort(legOrder);
}

export async function listCrateLegs(
  db: EquipotDb,
  campaignId: string,
  crateId: string,
): Promise<LocalLeg[]> {
  const all = await db.legs.where("crateId").equals(crateId).toArray();
  return all.filter((l) => l.campaignId === campaignId).sort(legOrder);
}

const handoverOrder = (a: LocalHandover, b: LocalHandover) =>
  Date.parse(a.at) - Date.parse(b.at) || a.id.localeCompare(b.id);

/** The chain of custody of a crate, oldest first. */
export async function listCrateHandovers(
  db: EquipotDb,
  campaignId: string,
  crateId: string,
): Promise<LocalHandover[]> {
  const all = await db.handovers.where("crateId").equals(crateId).toArray();
  return all.filter((h) => h.campaignId === campaignId).sort(handoverOrder);
}

export async function listHandovers(db: EquipotDb, campaignId: string): Promise<LocalHandover[]> {
  const all = await db.handovers.where("campaignId").equals(campaignId).toArray();
  return all.sort(handoverOrder);
}

export async function lastHandover(
  db: EquipotDb,
  campaignId: string,
  crateId: string,
): Promise<LocalHandover | null> {
  return (await listCrateHandovers(db, campaignId, crateId)).at(-1) ?? null;
}

const alertOrder = (a: LocalAlert, b: LocalAlert) =>
  b.createdAt.localeCompare(a.createdAt) || a.id.localeCompare(b.id);

/** The campaign's alerts, newest first. */
export async function listAlerts(db: EquipotDb, campaignId: string): Promise<LocalAlert[]> {
  const all = await db.alerts.where("campaignId").equals(campaignId).toArray();
  return all.sort(alertOrder);
}

export async function listCrateAlerts(
  db: EquipotDb,
  campaignId: string,
  crateId: string,
): Promise<LocalAlert[]> {
  const all = await db.alerts.where("crateId").equals(crateId).toArray();
  return all.filter((a) => a.campaignId === campaignId).sort(alertOrder);
}

/** Names match when equal after trimming, ignoring case (a typed signature, not an account). */

/** Who holds the crate: the receiver of its last handover (chain oldest first), or null. */
export const currentHolder = (chain: readonly Pick<LocalHandover, "toName">[]) =>
  chain.at(-1)?.toName.trim() ?? null;

export type CratePlace =
  { kind: "at"; siteId: string } | { kind: "moving"; toSiteId: string } | { kind: "unknown" };

/**
 * Where a crate is: on the way when a leg departed and has not arrived; otherwise at the
 * destination of its last arrived leg (latest arrival); unknown when no leg arrived yet.
 */
export function cratePlace(legs: readonly LocalLeg[]): CratePlace {
  const moving = legs.find((l) => legState(l) === "under-way");
  if (moving) return { kind: "moving", toSiteId: moving.toSiteId };
  let last: { at: number; siteId: string } | null = null;
  for (const leg of legs) {
    if (legState(leg) !== "arrived" || leg.arrivedAt === null) continue;
    const at = Date.parse(leg.arrivedAt);
    if (last === null || at > last.at) last = { at, siteId: leg.toSiteId };
  }
  return last === null ? { kind: "unknown" } : { kind: "at", siteId: last.siteId };
}

/** Legs whose planned arrival has passed without an arrival (cancelled ones left out). */
export function overdueLegs(legs: readonly LocalLeg[], now: number): LocalLeg[] {
  return legs.filter(
    (l) => l.arrivedAt === null && l.cancelledAt === null && Date.parse(l.plannedArriveAt) < now,
  );
}

/** Arrived legs with no handover of their crate at or after the arrival. */
export function pendingHandovers(
  legs: readonly LocalLeg[],
  handovers: readonly LocalHandover[],
): LocalLeg[] {
  return legs.filter((l) => {
    if (l.arrivedAt === null || l.cancelledAt !== null) return false;
    const arrived = Date.parse(l.arrivedAt);
    return !handovers.some((h) => h.crateId === l.crateId && Date.parse(h.at) >= arrived);
  });
}

/** How many crates are in each state, every state listed. */
/**
 * The crate's state as this device knows it: the server moves it when a leg departs or arrives,
 * so a step still waiting to be sent shows its effect here at once.
 */
export function shownCrateState(
  crate: Pick<CrateView, "state">,
  legs: readonly LocalLeg[],
): CrateState {
  const pending = legs.filter((l) => l.pending && legState(l) !== "cancelled");
  if (pending.some((l) => legState(l) === "under-way")) return "moving";
  if (pending.some((l) => legState(l) === "arrived")) return "arrived";
  return crate.state;
}

export function countByState(
  crates: readonly Pick<CrateView, "state">[],
  states: readonly CrateState[],
): Record<CrateState, number> {
  const counts = Object.fromEntries(states.map((s) => [s, 0])) as Record<CrateState, number>;
  for (const c of crates) counts[c.state] += 1;
  return counts;
}

export async function findHandover(
  db: EquipotDb,
  campaignId: string,
  handoverId: string,
): Promise<LocalHandover | null> {
  const handover = await db.handovers.get(handoverId);
  return handover && handover.campaignId === campaignId ? handover : null;
}

/** How many photos and files each record has (removed ones left out), by subject id. */
export async function countAttachmentsBySubject(
  db: EquipotDb,
  campaignId: string,
  subjectIds: readonly string[],
): Promise<Map<string, number>> {
  const all = await db.attachments.where("subject.id").anyOf(subjectIds).toArray();
  const counts = new Map<string, number>();
  for (const a of all)
    if (a.campaignId === campaignId && a.removedAt === null)
      counts.set(a.subject.id, (counts.get(a.subject.id) ?? 0) + 1);
  return counts;
}
