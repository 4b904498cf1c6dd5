// Sends an archive to become a new campaign; then refreshes the session so that the new
// membership (admin of the new campaign) reaches the campaign list.
import { useMutation } from "@tanstack/react-query";
import {
  archiveImportResult,
  type ArchiveImportResult,
} from "../../../../shared/schemas/campaign-archive";
import { refreshSession } from "../../../lib/api";
import { ApiError } from "../../../lib/api-error";
import { transfer, type TransferProgress } from "./transfer";

export interface ImportRequest {
  file: File;
  name: string;
  onProgress: (progress: TransferProgress) => void;
}

export async function importArchive(request: ImportRequest): Promise<ArchiveImportResult> {
  const { blob } = await transfer({
    method: "POST",
    path: `/campaigns/import?name=${encodeURIComponent(request.name)}`,
    body: request.file,
    contentType: "application/zip",
    onProgress: request.onProgress,
  });
  let answer: unknown = null;
  try {
    answer = JSON.parse(await blob.text());
  } catch {
    // Left null: refused below as not understood.
  }
  const parsed = archiveImportResult.safeParse(answer);
  if (!parsed.success)
    throw new ApiError(200, "bad_response", "The server's answer was not understood.");
  // The memberships come with the session: a refresh brings the new campaign in.
  await refreshSession().catch(() => undefined);
  return parsed.data;
}

export function useImportArchive() {
  return useMutation({ mutationFn: importArchive });
}
