// The campaign's clocks and links, persisted with the query cache so they read offline.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { instrumentView, type InstrumentView } from "../../../../shared/schemas/instruments";
import { apiRequest } from "../../../lib/api";
import { instrumentKeys, instrumentsBase } from "./keys";

const instrumentsResponse = z.object({ instruments: z.array(instrumentView) });

export async function listInstruments(
  campaignId: string,
  signal?: AbortSignal,
): Promise<InstrumentView[]> {
  const { instruments } = await apiRequest(instrumentsBase(campaignId), {
    schema: instrumentsResponse,
    signal,
  });
  return instruments;
}

export function instrumentsQueryOptions(campaignId: string) {
  return queryOptions({
    queryKey: instrumentKeys.list(campaignId),
    queryFn: ({ signal }) => listInstruments(campaignId, signal),
  });
}

export function useInstruments(campaignId: string) {
  return useQuery(instrumentsQueryOptions(campaignId));
}
