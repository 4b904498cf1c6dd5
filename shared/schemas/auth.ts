import { z } from "zod";
import { roles } from "../permissions";
import { limits } from "./limits";

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(limits.emailMax, `E-mail must be at most ${limits.emailMax} characters`)
  .pipe(z.email("Enter a valid e-mail address"));

export const passwordSchema = z
  .string()
  .min(limits.passwordMin, `Password must be at least ${limits.passwordMin} characters`)
  .max(limits.passwordMax, `Password must be at most ${limits.passwordMax} characters`);

export const signInInput = z.strictObject({
  email: emailSchema,
  // Sign-in accepts any non-empty password so that old, shorter passwords are answered 401, not 400.
  password: z.string().min(1, "Enter your password").max(limits.passwordMax),
});
export type SignInInput = z.infer<typeof signInInput>;

export const roleSchema = z.enum(roles);

export const userView = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
});
export type UserView = z.infer<typeof userView>;

export const membershipView = z.object({
  campaignId: z.uuid(),
  campaignName: z.string(),
  role: roleSchema,
});
export type MembershipView = z.infer<typeof membershipView>;

export const sessionView = z.object({
  accessToken: z.string(),
  user: userView,
  memberships: z.array(membershipView),
});
export type SessionView = z.infer<typeof sessionView>;

export const meView = sessionView.omit({ accessToken: true });
export type MeView = z.infer<typeof meView>;

export const inviteInput = z.strictObject({
  email: emailSchema,
  role: roleSchema,
});
export type InviteInput = z.infer<typeof inviteInput>;

export const acceptInviteInput = z.strictObject({
  token: z.string().min(20, "Invite token is missing or cut short").max(200),
  name: z.string().trim().min(1, "Enter your name").max(limits.nameMax),
  password: passwordSchema,
});
export type AcceptInviteInput = z.infer<typeof acceptInviteInput>;

// Cookie-carrying requests must send this header; a cross-site form cannot set it.
export const requestHeader = { name: "x-equipot-request", value: "1" } as const;
export const refreshCookieName = "equipot_refresh";
