// POST …/height-ties/import: the file's text; a refused file answers 422 with its bad rows by line.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { heightTieView, type HeightTieView } from "../../../../shared/schemas/height-network";
import { apiErrorFrom, reachServer, withAccessToken } from "../../../lib/api";
import { ApiError } from "../../../lib/api-error";
import { campaignBase, heightNetworkKeys } from "./keys";

export const tieRowError = z.object({
  row: z.number().int(),
  field: z.string(),
  message: z.string(),
});
export type TieRowError = z.infer<typeof tieRowError>;

const refusal = z.object({
  error: z.object({
    code: z.literal("invalid_file"),
    message: z.string(),
    rows: z.array(tieRowError),
  }),
});
const imported = z.object({ ties: z.array(heightTieView) });

/** The file was read and refused; nothing was stored. */
export class TieFileRefused extends Error {
  constructor(
    message: string,
    readonly rows: readonly TieRowError[],
  ) {
    super(message);
  }
}

export async function importTies(
  campaignId: string,
  file: { fileName: string; content: string },
): Promise<HeightTieView[]> {
  const response = await withAccessToken((headers) =>
    reachServer(`${campaignBase(campaignId)}/height-ties/import`, {
      method: "POST",
      headers: { ...headers, Accept: "application/json", "Content-Type": "application/json" },
      body: JSON.stringify(file),
      cache: "no-store",
    }),
  );
  const body: unknown = await response.json().catch(() => undefined);
  if (response.status === 422) {
    const refused = refusal.safeParse(body);
    if (refused.success)
      throw new TieFileRefused(refused.data.error.message, refused.data.error.rows);
  }
  if (!response.ok) throw apiErrorFrom(response.status, body);
  const parsed = imported.safeParse(body);
  if (!parsed.success)
    throw new ApiError(response.status, "bad_response", "The server's answer was not understood.");
  return parsed.data.ties;
}

export function useImportTies(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: { fileName: string; content: string }) => importTies(campaignId, file),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: heightNetworkKeys.observations(campaignId) }),
  });
}
