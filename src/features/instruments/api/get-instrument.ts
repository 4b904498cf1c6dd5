// One clock or link as stored now.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { instrumentView, type InstrumentView } from "../../../../shared/schemas/instruments";
import { apiRequest } from "../../../lib/api";
import { instrumentKeys, instrumentPath } from "./keys";

const instrumentResponse = z.object({ instrument: instrumentView });

export async function getInstrument(
  campaignId: string,
  instrumentId: string,
  signal?: AbortSignal,
): Promise<InstrumentView> {
  const res = await apiRequest(instrumentPath(campaignId, instrumentId), {
    schema: instrumentResponse,
    signal,
  });
  return res.instrument;
}

export function instrumentQueryOptions(campaignId: string, instrumentId: string) {
  return queryOptions({
    queryKey: instrumentKeys.one(campaignId, instrumentId),
    queryFn: ({ signal }) => getInstrument(campaignId, instrumentId, signal),
  });
}

export function useInstrument(campaignId: string, instrumentId: string) {
  return useQuery(instrumentQueryOptions(campaignId, instrumentId));
}
