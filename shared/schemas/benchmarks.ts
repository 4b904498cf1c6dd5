import { z } from "zod";

export const benchmarkView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  code: z.string(),
  description: z.string(),
  latitudeDeg: z.number(),
  longitudeDeg: z.number(),
  heightM: z.number(),
  heightSigmaM: z.number(),
  heightSystem: z.string(),
  source: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type BenchmarkView = z.infer<typeof benchmarkView>;
