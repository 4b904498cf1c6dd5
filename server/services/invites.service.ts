// Invites by e-mail: the link carries a one-time token (only its hash is stored); accepting it
// creates the account (or sets a new password for an existing one: the token proves the address).
import { eq } from "drizzle-orm";
import { roleLabels } from "../../shared/permissions";
import type { AcceptInviteInput, InviteInput } from "../../shared/schemas/auth";
import type { Db } from "../db/client";
import { recordAudit } from "../db/repositories/audit";
import {
  findCampaign,
  findOpenInviteForUpdate,
  insertInvite,
  markInviteAccepted,
  upsertMembership,
} from "../db/repositories/campaigns";
import { enqueueEmail } from "../db/repositories/outbox";
import { findUserByEmail } from "../db/repositories/users";
import { asSystem } from "../db/scope";
import { users } from "../db/schema";
import { notFound } from "../http-errors";
import { issueNewSession, type AuthDeps } from "./auth.service";
import { hashPassword } from "./passwords";
import { hashOpaqueToken, newOpaqueToken } from "./tokens";

const inviteTtlS = 7 * 24 * 3600;

export async function createInvite(
  db: Db,
  scope: { campaignId: string; userId: string },
  input: InviteInput,
  publicUrl: string,
) {
  const token = newOpaqueToken();
  return db.transaction(async (tx) => {
    const campaign = await findCampaign(tx, scope.campaignId);
    if (!campaign) throw notFound("Campaign not found");
    const expiresAt = new Date(Date.now() + inviteTtlS * 1000);
    const row = await insertInvite(tx, {
      ...scope,
      invitedBy: scope.userId,
      email: input.email,
      role: input.role,
      tokenHash: hashOpaqueToken(token),
      expiresAt,
    });
    const link = `${publicUrl.replace(/\/$/, "")}/invite/${token}`;
    await enqueueEmail(tx, {
      toAddress: input.email,
      subject: `You are invited to the Equipot campaign "${campaign.name}"`,
      textBody: [
        `You have been invited to join the campaign "${campaign.name}" in Equipot as ${roleLabels[input.role]}.`,
        "",
        `Open this link to choose your password (valid for 7 days):`,
        link,
        "",
        "If you did not expect this message, you can ignore it.",
      ].join("\n"),
    });
    await recordAudit(tx, {
      ...scope,
      action: "invite",
      entity: "invite",
      entityId: row.id,
      after: { email: input.email, role: input.role },
    });
    return { email: row.email, role: row.role, expiresAt: row.expiresAt.toISOString() };
  });
}

export async function acceptInvite(deps: AuthDeps, input: AcceptInviteInput) {
  const passwordHash = await hashPassword(input.password);
  // The campaign is known only from the invite, and the person is not a member yet.
  return asSystem("accepting an invitation", () =>
    deps.db.transaction(async (tx) => {
      const invite = await findOpenInviteForUpdate(tx, hashOpaqueToken(input.token));
      if (!invite) throw notFound("This invite link is not valid any more. Ask for a new one.");
      const existing = await findUserByEmail(tx, invite.email);
      let userId = existing?.id;
      if (existing) {
        await tx.update(users).set({ passwordHash }).where(eq(users.id, existing.id));
      } else {
        const [created] = await tx
          .insert(users)
          .values({ email: invite.email, name: input.name, passwordHash })
          .returning({ id: users.id });
        userId = created?.id;
      }
      if (!userId) throw new Error("user was not created");
      await upsertMembership(tx, invite.campaignId, userId, invite.role);
      await markInviteAccepted(tx, invite.id);
      await recordAudit(tx, {
        campaignId: invite.campaignId,
        userId,
        action: "accept-invite",
        entity: "membership",
        entityId: userId,
        after: { role: invite.role },
      });
      return issueNewSession(deps, tx, userId);
    }),
  );
}
