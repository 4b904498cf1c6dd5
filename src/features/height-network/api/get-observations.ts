// The network as it stands: closed field-book sections and imported ties; persisted for offline reading.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { observationSource } from "../../../../shared/schemas/height-network";
import { apiRequest } from "../../../lib/api";
import { campaignBase, heightNetworkKeys } from "./keys";

/** GET …/height-network/observations (server/presenters/height-network.ts). */
export const networkObservationView = z.object({
  sourceId: z.uuid(),
  source: observationSource,
  origin: z.string(),
  fromMark: z.string(),
  toMark: z.string(),
  deltaM: z.number(),
  lengthKm: z.number(),
  sigmaM: z.number().nullable(),
});
export type NetworkObservationView = z.infer<typeof networkObservationView>;

const observationsResponse = z.object({ observations: z.array(networkObservationView) });

export function observationsQueryOptions(campaignId: string) {
  return queryOptions({
    queryKey: heightNetworkKeys.observations(campaignId),
    queryFn: async ({ signal }) =>
      (
        await apiRequest(`${campaignBase(campaignId)}/height-network/observations`, {
          schema: observationsResponse,
          signal,
        })
      ).observations,
  });
}

export function useNetworkObservations(campaignId: string) {
  return useQuery(observationsQueryOptions(campaignId));
}
