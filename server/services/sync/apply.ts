// Dispatches one pushed mutation: validate its arguments, check the permission with the user's
// current role, then apply. Anything refused becomes a Rejection, recorded with the whole mutation.
import type { z } from "zod";
import { can, type Role } from "../../../shared/permissions";
import {
  mutationActions,
  mutationSchemas,
  type MutationEnvelope,
} from "../../../shared/sync/protocol";
import { applyAttachmentAdd, applyAttachmentRemove } from "./attachment-mutations";
import { applyConflictResolve } from "./conflict-mutations";
import { Rejection, type ApplyContext, type ApplyOutcome } from "./context";
import { applySiteCreate, applySiteDelete, applySiteUpdate } from "./site-mutations";

function parseArgs<S extends z.ZodType>(name: string, schema: S, args: unknown): z.output<S> {
  const parsed = schema.safeParse(args);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const where = issue?.path.length ? `${issue.path.join(".")}: ` : "";
  throw new Rejection(`Invalid ${name}: ${where}${issue?.message ?? "invalid arguments"}`);
}

export async function applyMutation(
  ctx: Omit<ApplyContext, "role"> & { role: Role | undefined },
  mutation: MutationEnvelope,
): Promise<ApplyOutcome> {
  const { role } = ctx;
  if (!role)
    throw new Rejection(
      "You are not a member of this campaign (any more); the change is kept for recovery",
    );
  if (!can(role, mutationActions[mutation.name])) {
    throw new Rejection(
      "Your role in this campaign does not allow this change; it is kept for recovery",
    );
  }
  const full: ApplyContext = { ...ctx, role };
  switch (mutation.name) {
    case "site.create":
      return applySiteCreate(
        full,
        parseArgs("site.create", mutationSchemas["site.create"], mutation.args),
      );
    case "site.update":
      return applySiteUpdate(
        full,
        parseArgs("site.update", mutationSchemas["site.update"], mutation.args),
      );
    case "site.delete":
      return applySiteDelete(
        full,
        parseArgs("site.delete", mutationSchemas["site.delete"], mutation.args),
      );
    case "conflict.resolve":
      return applyConflictResolve(
        full,
        parseArgs("conflict.resolve", mutationSchemas["conflict.resolve"], mutation.args),
      );
    case "attachment.add":
      return applyAttachmentAdd(
        full,
        parseArgs("attachment.add", mutationSchemas["attachment.add"], mutation.args),
      );
    case "attachment.remove":
      return applyAttachmentRemove(
        full,
        parseArgs("attachment.remove", mutationSchemas["attachment.remove"], mutation.args),
      );
  }
}
