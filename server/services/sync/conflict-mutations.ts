// Resolving a conflict is a mutation like any other: the chosen value is written to the field
// (checked by the field's own schema) and the conflict is closed, both in the change stream.
import type { z } from "zod";
import { sitePatchSchema, type SitePatch } from "../../../shared/schemas/sites";
import { nextChangeSeq } from "../../db/change-seq";
import { findSiteForUpdate, updateSite } from "../../db/repositories/sites";
import { findConflictForUpdate, updateConflict } from "../../db/repositories/sync";
import { presentSite } from "../../presenters/site";
import { auditChange, Rejection, type ApplyContext, type ApplyOutcome, type Args } from "./context";

type ResolveArgs = Args<"conflict.resolve">;

function checkedValue(field: string, value: unknown): unknown {
  const shape: Record<string, z.ZodType> = sitePatchSchema.shape;
  const schema = shape[field];
  if (!schema) throw new Rejection(`The conflict is about an unknown field "${field}"`);
  if (value === undefined) throw new Rejection(`${field}: choose a value`);
  const parsed = schema.safeParse(value);
  if (!parsed.success)
    throw new Rejection(`${field}: ${parsed.error.issues[0]?.message ?? "invalid value"}`);
  return parsed.data;
}

export async function applyConflictResolve(
  ctx: ApplyContext,
  args: ResolveArgs,
): Promise<ApplyOutcome> {
  const conflict = await findConflictForUpdate(ctx.tx, ctx.campaignId, args.id);
  if (!conflict) throw new Rejection("Conflict not found");
  if (conflict.resolvedAt) return { status: "applied", message: "Already resolved" };
  const value = checkedValue(conflict.field, args.value);
  const site = await findSiteForUpdate(ctx.tx, ctx.campaignId, conflict.entityId);
  if (!site) throw new Rejection("Site not found");
  if (
    !site.deletedAt &&
    JSON.stringify(site[conflict.field as keyof SitePatch]) !== JSON.stringify(value)
  ) {
    const row = await updateSite(ctx.tx, site.id, {
      [conflict.field]: value,
      version: site.version + 1,
      updatedAt: new Date(),
      updatedBy: ctx.userId,
      changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
    });
    await auditChange(ctx, {
      action: "resolve-conflict",
      entity: "site",
      entityId: site.id,
      before: presentSite(site),
      after: presentSite(row),
    });
  }
  await updateConflict(ctx.tx, conflict.id, {
    resolvedAt: new Date(),
    resolvedBy: ctx.userId,
    resolvedValue: value,
    version: conflict.version + 1,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  return { status: "applied" };
}
