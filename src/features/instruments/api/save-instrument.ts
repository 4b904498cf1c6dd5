// Instruments are edited online (REST): a new one carries a client-made id, an edit the version it
// started from (409 when someone else changed it meanwhile).
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  instrumentView,
  type InstrumentFields,
  type InstrumentView,
} from "../../../../shared/schemas/instruments";
import { apiRequest } from "../../../lib/api";
import { instrumentKeys, instrumentPath, instrumentsBase } from "./keys";

const instrumentResponse = z.object({ instrument: instrumentView });

export interface SaveInstrumentInput {
  id: string;
  /** null for a new instrument. */
  baseVersion: number | null;
  instrument: InstrumentFields;
}

export async function saveInstrument(
  campaignId: string,
  input: SaveInstrumentInput,
): Promise<InstrumentView> {
  const res =
    input.baseVersion === null
      ? await apiRequest(instrumentsBase(campaignId), {
          method: "POST",
          body: { id: input.id, instrument: input.instrument },
          schema: instrumentResponse,
        })
      : await apiRequest(instrumentPath(campaignId, input.id), {
          method: "PUT",
          body: { baseVersion: input.baseVersion, instrument: input.instrument },
          schema: instrumentResponse,
        });
  return res.instrument;
}

export function useSaveInstrument(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveInstrumentInput) => saveInstrument(campaignId, input),
    onSuccess: async (instrument) => {
      queryClient.setQueryData(instrumentKeys.one(campaignId, instrument.id), instrument);
      // The list shows the saved figures at once, before its own refetch answers.
      queryClient.setQueryData(instrumentKeys.list(campaignId), (list: InstrumentView[] = []) =>
        list.some((i) => i.id === instrument.id)
          ? list.map((i) => (i.id === instrument.id ? instrument : i))
          : [...list, instrument],
      );
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: instrumentKeys.list(campaignId) }),
        queryClient.invalidateQueries({
          queryKey: instrumentKeys.history(campaignId, instrument.id),
        }),
      ]);
    },
  });
}
