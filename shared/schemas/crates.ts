import { z } from "zod";
import { crateState } from "./logistics";

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
  // Defaults keep pulls from servers before these fields readable.
  instrument: z.string().default(""),
  maxTiltDeg: z.number().nullable().default(null),
  state: crateState.default("ready"),
  version: z.number().int(),
  updatedAt: z.string(),
  deletedAt: z.string().nullable().default(null),
});
export type CrateView = z.infer<typeof crateView>;
