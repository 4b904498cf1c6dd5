// How each site mutation is applied. Edits merge field by field against the value the client saw:
// a field nobody else changed takes the client's value; a field changed on both sides keeps the
// server's value and opens a conflict holding both, for a person to resolve.
import type { SitePatch } from "../../../shared/schemas/sites";
import { nextChangeSeq, takeChangeSeqs } from "../../db/change-seq";
import { recordAudits, type AuditEntry } from "../../db/repositories/audit";
import {
  findSiteForUpdate,
  insertSites,
  takenSiteIds,
  updateSite,
} from "../../db/repositories/sites";
import { insertConflict } from "../../db/repositories/sync";
import { presentSite } from "../../presenters/site";
import {
  auditChange,
  Rejection,
  sameValue,
  type ApplyContext,
  type ApplyOutcome,
  type Args,
  type Settled,
} from "./context";

type SiteField = keyof SitePatch;

/** What an audit row and a run of creates need: no single mutation id, no role past the checks. */
type WriteContext = Omit<ApplyContext, "mutationId" | "role">;

const auditEntry = (
  ctx: WriteContext,
  action: string,
  entityId: string,
  before: unknown,
  after: unknown,
): AuditEntry => ({
  campaignId: ctx.campaignId,
  userId: ctx.userId,
  clientId: ctx.clientId,
  action,
  entity: "site",
  entityId,
  before,
  after,
});

const audit = (
  ctx: WriteContext,
  action: string,
  entityId: string,
  before: unknown,
  after: unknown,
) => auditChange(ctx, { action, entity: "site", entityId, before, after });

/**
 * Applies a run of consecutive creates with one query per step rather than four per create, with
 * the outcome of applying them one by one: a create already refused by its checks stays refused;
 * an id already taken, on the server or by an earlier create of the run, is refused; the others
 * take consecutive change positions in their order.
 */
export async function applySiteCreates(
  ctx: WriteContext,
  creates: (Args<"site.create"> | Rejection)[],
): Promise<Settled[]> {
  const checked = creates.filter((c): c is Args<"site.create"> => !(c instanceof Rejection));
  const taken = await takenSiteIds(
    ctx.tx,
    checked.map((args) => args.id),
  );
  const settled: Settled[] = [];
  const accepted: Args<"site.create">[] = [];
  for (const args of creates) {
    if (args instanceof Rejection) {
      settled.push(args);
      continue;
    }
    // PostgreSQL compares uuids regardless of case, and answers them in lower case.
    const key = args.id.toLowerCase();
    if (taken.has(key)) {
      settled.push(new Rejection("A site with this id already exists"));
      continue;
    }
    taken.add(key);
    accepted.push(args);
    settled.push({ status: "applied" });
  }
  if (accepted.length === 0) return settled;
  const first = await takeChangeSeqs(ctx.tx, ctx.campaignId, accepted.length);
  const rows = await insertSites(
    ctx.tx,
    accepted.map((args, i) => ({
      ...args,
      campaignId: ctx.campaignId,
      updatedBy: ctx.userId,
      changeSeq: first + i,
    })),
  );
  await recordAudits(
    ctx.tx,
    rows.map((row) => auditEntry(ctx, "create", row.id, null, presentSite(row))),
  );
  return settled;
}

export async function applySiteUpdate(
  ctx: ApplyContext,
  args: Args<"site.update">,
): Promise<ApplyOutcome> {
  const current = await findSiteForUpdate(ctx.tx, ctx.campaignId, args.id);
  if (!current) throw new Rejection("Site not found");
  if (current.deletedAt)
    throw new Rejection("This site was deleted on the server; the edit is kept for recovery");
  const patch: SitePatch = {};
  const conflicted: SiteField[] = [];
  for (const field of Object.keys(args.changes) as SiteField[]) {
    const mine = args.changes[field];
    const theirs = current[field];
    if (sameValue(theirs, mine)) continue;
    if (sameValue(theirs, args.base[field])) Object.assign(patch, { [field]: mine });
    else conflicted.push(field);
  }
  for (const field of conflicted) {
    await insertConflict(ctx.tx, {
      campaignId: ctx.campaignId,
      entity: "site",
      entityId: current.id,
      field,
      baseValue: args.base[field] ?? null,
      serverValue: current[field],
      clientValue: args.changes[field],
      clientId: ctx.clientId,
      mutationId: ctx.mutationId,
      openedBy: ctx.userId,
      changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
    });
  }
  if (Object.keys(patch).length > 0) {
    const row = await updateSite(ctx.tx, current.id, {
      ...patch,
      version: current.version + 1,
      updatedAt: new Date(),
      updatedBy: ctx.userId,
      changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
    });
    await audit(ctx, "update", row.id, presentSite(current), presentSite(row));
  }
  if (conflicted.length === 0) return { status: "applied" };
  return {
    status: "conflict",
    message: `Changed on both sides, kept for you to choose: ${conflicted.join(", ")}`,
  };
}

export async function applySiteDelete(
  ctx: ApplyContext,
  args: Args<"site.delete">,
): Promise<ApplyOutcome> {
  const current = await findSiteForUpdate(ctx.tx, ctx.campaignId, args.id);
  if (!current) throw new Rejection("Site not found");
  if (current.deletedAt) return { status: "applied", message: "Already deleted" };
  const now = new Date();
  const row = await updateSite(ctx.tx, current.id, {
    deletedAt: now,
    updatedAt: now,
    updatedBy: ctx.userId,
    version: current.version + 1,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await audit(ctx, "delete", row.id, presentSite(current), null);
  return { status: "applied" };
}
