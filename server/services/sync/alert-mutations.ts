// Acknowledging an alert: done once, by logistics (or an administrator). The row lock orders two
// tablets acknowledging together; the second is told it was already done, and nothing changes.
import { nextChangeSeq } from "../../db/change-seq";
import { findAlertForUpdate, updateAlert } from "../../db/repositories/alerts";
import { presentAlert } from "../../presenters/alert";
import { auditChange, Rejection, type ApplyContext, type ApplyOutcome, type Args } from "./context";

export async function applyAlertAcknowledge(
  ctx: ApplyContext,
  args: Args<"alert.acknowledge">,
): Promise<ApplyOutcome> {
  const alert = await findAlertForUpdate(ctx.tx, ctx.campaignId, args.id);
  if (!alert) throw new Rejection("This alert is not in this campaign");
  if (alert.acknowledgedAt) return { status: "applied", message: "Already acknowledged" };
  const row = await updateAlert(ctx.tx, alert.id, {
    acknowledgedAt: new Date(args.at),
    acknowledgedBy: ctx.userId,
    acknowledgeNote: args.note,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await auditChange(ctx, {
    action: "acknowledge",
    entity: "alert",
    entityId: row.id,
    before: presentAlert(alert),
    after: presentAlert(row),
  });
  return { status: "applied" };
}
