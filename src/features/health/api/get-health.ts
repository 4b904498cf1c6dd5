import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { apiRequest } from "../../../lib/api";

const healthView = z.object({
  status: z.string(),
  database: z.string().optional(),
  demo: z.boolean().default(false),
});
export type HealthView = z.infer<typeof healthView>;

export const healthKeys = { all: ["health"] as const };

export function getHealth(signal?: AbortSignal): Promise<HealthView> {
  return apiRequest("/health", { schema: healthView, auth: false, signal });
}

export const healthQueryOptions = queryOptions({
  queryKey: healthKeys.all,
  queryFn: ({ signal }) => getHealth(signal),
  staleTime: 5 * 60_000,
  retry: false,
  // Whether this is a demo server is asked afresh each visit, not read from the cache.
  meta: { persist: false },
});

export function useHealth() {
  return useQuery(healthQueryOptions);
}
