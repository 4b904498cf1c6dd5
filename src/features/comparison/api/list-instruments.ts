// The campaign's clocks and links, to choose from in the run form.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { instrumentView, type InstrumentView } from "../../../../shared/schemas/instruments";
import { apiRequest } from "../../../lib/api";
import { comparisonKeys } from "./keys";

const instrumentsResponse = z.object({ instruments: z.array(instrumentView) });

export async function listInstruments(
  campaignId: string,
  signal?: AbortSignal,
): Promise<InstrumentView[]> {
  const { instruments } = await apiRequest(
    `/campaigns/${encodeURIComponent(campaignId)}/instruments`,
    { schema: instrumentsResponse, signal },
  );
  return instruments;
}

export function useInstruments(campaignId: string) {
  return useQuery(
    queryOptions({
      queryKey: comparisonKeys.instruments(campaignId),
      queryFn: ({ signal }) => listInstruments(campaignId, signal),
    }),
  );
}
