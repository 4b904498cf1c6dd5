import { z } from "zod";

export const crateView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  label: z.string(),
  contents: z.string(),
  weightKg: z.number(),
  maxShockG: z.number(),
  temperatureMinC: z.number(),
  temperatureMaxC: z.number(),
  notes: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type CrateView = z.infer<typeof crateView>;
