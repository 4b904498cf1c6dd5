import { z } from "zod";
import { roleSchema } from "./auth";

export const campaignView = z.object({
  id: z.uuid(),
  name: z.string(),
  description: z.string(),
  role: roleSchema,
});
export type CampaignView = z.infer<typeof campaignView>;

export const memberView = z.object({
  userId: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
});
export type MemberView = z.infer<typeof memberView>;

export const memberRoleInput = z.strictObject({ role: roleSchema });
