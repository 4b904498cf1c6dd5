// An instrument's revisions from the audit trail, oldest first: when, who, what changed.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import {
  instrumentRevisionView,
  type InstrumentRevisionView,
} from "../../../../shared/schemas/instruments";
import { apiRequest } from "../../../lib/api";
import { instrumentKeys, instrumentPath } from "./keys";

const historyResponse = z.object({ revisions: z.array(instrumentRevisionView) });

export async function getInstrumentHistory(
  campaignId: string,
  instrumentId: string,
  signal?: AbortSignal,
): Promise<InstrumentRevisionView[]> {
  const res = await apiRequest(`${instrumentPath(campaignId, instrumentId)}/history`, {
    schema: historyResponse,
    signal,
  });
  return res.revisions;
}

export function instrumentHistoryQueryOptions(campaignId: string, instrumentId: string) {
  return queryOptions({
    queryKey: instrumentKeys.history(campaignId, instrumentId),
    queryFn: ({ signal }) => getInstrumentHistory(campaignId, instrumentId, signal),
  });
}

export function useInstrumentHistory(campaignId: string, instrumentId: string) {
  return useQuery(instrumentHistoryQueryOptions(campaignId, instrumentId));
}
