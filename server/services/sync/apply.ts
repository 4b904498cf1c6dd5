// Dispatches pushed mutations: validate the arguments, check the permission with the user's
// current role, then apply. Anything refused becomes a Rejection, recorded with the whole mutation.
// A run of consecutive creates is applied together (see applySiteCreates), the rest one by one.
import type { z } from "zod";
import { can, type Role } from "../../../shared/permissions";
import {
  mutationActions,
  mutationSchemas,
  type MutationEnvelope,
  type MutationName,
} from "../../../shared/sync/protocol";
import { applyAlertAcknowledge } from "./alert-mutations";
import { applyAttachmentAdd, applyAttachmentRemove } from "./attachment-mutations";
import {
  applyChecklistRecord,
  applyChecklistSignOff,
  applyChecklistStart,
} from "./checklist-mutations";
import { applyConflictResolve } from "./conflict-mutations";
import {
  Rejection,
  type ApplyContext,
  type ApplyOutcome,
  type Args,
  type Settled,
} from "./context";
import { applyEntryAdd } from "./field-entry-mutations";
import { applyHandoverRecord } from "./handover-mutations";
import { applyLegArrive, applyLegCancel, applyLegDepart, applyLegPlan } from "./leg-mutations";
import {
  applyLevellingClose,
  applyLevellingOpen,
  applyLevellingSetup,
} from "./levelling-mutations";
import { refuseIfApproved } from "./review-guard";
import { applySiteCreates, applySiteDelete, applySiteUpdate } from "./site-mutations";

type PushContext = Omit<ApplyContext, "role"> & { role: Role | undefined };
type SiteCreate = Args<"site.create"> | Rejection;

function parseArgs<S extends z.ZodType>(name: string, schema: S, args: unknown): z.output<S> {
  const parsed = schema.safeParse(args);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const where = issue?.path.length ? `${issue.path.join(".")}: ` : "";
  throw new Rejection(`Invalid ${name}: ${where}${issue?.message ?? "invalid arguments"}`);
}

function allowedRole(role: Role | undefined, name: MutationName): Role {
  if (!role)
    throw new Rejection(
      "You are not a member of this campaign (any more); the change is kept for recovery",
    );
  if (!can(role, mutationActions[name])) {
    throw new Rejection(
      "Your role in this campaign does not allow this change; it is kept for recovery",
    );
  }
  return role;
}

/** A create's checks, on their own: a refusal keeps its place in the run. */
function checkSiteCreate(role: Role | undefined, mutation: MutationEnvelope): SiteCreate {
  try {
    allowedRole(role, mutation.name);
    return parseArgs("site.create", mutationSchemas["site.create"], mutation.args);
  } catch (error) {
    if (error instanceof Rejection) return error;
    throw error;
  }
}

/** A run of consecutive site.create mutations: checked one by one, applied together, in order. */
export const applySiteCreateRun = (
  ctx: Omit<PushContext, "mutationId">,
  mutations: MutationEnvelope[],
): Promise<Settled[]> =>
  applySiteCreates(
    ctx,
    mutations.map((m) => checkSiteCreate(ctx.role, m)),
  );

type Applier<N extends MutationName> = (ctx: ApplyContext, args: Args<N>) => Promise<ApplyOutcome>;

/** One apply function per mutation kind (creates go through the run above, even alone). */
const appliers: { [N in Exclude<MutationName, "site.create">]: Applier<N> } = {
  "site.update": applySiteUpdate,
  "site.delete": applySiteDelete,
  "conflict.resolve": applyConflictResolve,
  "attachment.add": applyAttachmentAdd,
  "attachment.remove": applyAttachmentRemove,
  "checklist.start": applyChecklistStart,
  "checklist.record": applyChecklistRecord,
  "checklist.signOff": applyChecklistSignOff,
  "entry.add": applyEntryAdd,
  "levelling.open": applyLevellingOpen,
  "levelling.setup": applyLevellingSetup,
  "levelling.close": applyLevellingClose,
  "leg.plan": applyLegPlan,
  "leg.depart": applyLegDepart,
  "leg.arrive": applyLegArrive,
  "leg.cancel": applyLegCancel,
  "handover.record": applyHandoverRecord,
  "alert.acknowledge": applyAlertAcknowledge,
};

async function applyOne<N extends Exclude<MutationName, "site.create">>(
  ctx: ApplyContext,
  name: N,
  rawArgs: unknown,
): Promise<ApplyOutcome> {
  const apply: Applier<N> = appliers[name];
  // The schema is the one of kind N, so its output is Args<N>; TypeScript cannot follow the index.
  const args = parseArgs(name, mutationSchemas[name], rawArgs) as Args<N>;
  await refuseIfApproved(ctx.tx, ctx.campaignId, name, args);
  return apply(ctx, args);
}

export async function applyMutation(
  ctx: PushContext,
  mutation: MutationEnvelope,
): Promise<ApplyOutcome> {
  const full: ApplyContext = { ...ctx, role: allowedRole(ctx.role, mutation.name) };
  if (mutation.name !== "site.create") return applyOne(full, mutation.name, mutation.args);
  const [settled] = await applySiteCreateRun(ctx, [mutation]);
  if (settled instanceof Rejection) throw settled;
  if (!settled) throw new Error("a run of one create gave no outcome");
  return settled;
}
