// A series file to the server as its raw bytes, with upload progress (fetch cannot report it,
// XMLHttpRequest can). The access token and refresh come from the one API client.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  comparisonFileView,
  seriesUploadRefusal,
  type ComparisonFileView,
  type SeriesRowError,
  type SeriesValueKind,
} from "../../../../shared/schemas/comparison";
import { env } from "../../../config/env";
import { apiErrorFrom, withAccessToken } from "../../../lib/api";
import { ApiError } from "../../../lib/api-error";
import { reportReachable } from "../../../lib/connectivity";
import { comparisonKeys, runPath } from "./keys";

const uploadAnswer = z.object({ file: comparisonFileView, dataRevision: z.number().int() });

/** A 422: the file was read and refused; nothing was stored. */
export class FileRefused extends Error {
  override readonly name = "FileRefused";
  constructor(
    message: string,
    readonly rows: readonly SeriesRowError[],
    readonly badRows: number,
  ) {
    super(message);
  }
}

export interface SeriesUpload {
  file: Blob;
  fileName: string;
  valueKind: SeriesValueKind;
  /** Only for ratio files, as typed (exact decimal). */
  nominalRatio?: string;
}

export function uploadQuery(upload: SeriesUpload): string {
  const query = new URLSearchParams({ fileName: upload.fileName, valueKind: upload.valueKind });
  if (upload.valueKind === "ratio" && upload.nominalRatio !== undefined)
    query.set("nominalRatio", upload.nominalRatio);
  return query.toString();
}

function post(
  url: string,
  body: Blob,
  headers: Record<string, string>,
  onProgress: (fraction: number) => void,
): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    for (const [name, value] of Object.entries(headers)) xhr.setRequestHeader(name, value);
    xhr.setRequestHeader("Content-Type", "text/csv");
    xhr.setRequestHeader("Accept", "application/json");
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      reportReachable(true);
      let parsed: unknown = null;
      try {
        parsed = JSON.parse(xhr.responseText) as unknown;
      } catch {
        // An empty or non-JSON answer: the status says enough.
      }
      resolve({ status: xhr.status, body: parsed });
    };
    xhr.onerror = () => {
      reportReachable(false);
      reject(ApiError.network(new Error("upload failed")));
    };
    xhr.send(body);
  });
}

export async function uploadSeries(
  campaignId: string,
  runId: string,
  upload: SeriesUpload,
  onProgress: (fraction: number) => void,
): Promise<{ file: ComparisonFileView; dataRevision: number }> {
  const url = `${env.apiBase}${runPath(campaignId, runId)}/files?${uploadQuery(upload)}`;
  const answer = await withAccessToken((headers) => post(url, upload.file, headers, onProgress));
  if (answer.status === 422) {
    const refusal = seriesUploadRefusal.safeParse(answer.body);
    if (refusal.success) {
      const { message, rows, badRows } = refusal.data.error;
      throw new FileRefused(message, rows, badRows);
    }
  }
  if (answer.status !== 201 && answer.status !== 200)
    throw apiErrorFrom(answer.status, answer.body);
  const parsed = uploadAnswer.safeParse(answer.body);
  if (!parsed.success)
    throw new ApiError(answer.status, "bad_response", "The server's answer was not understood.");
  return parsed.data;
}

export function useUploadSeries(campaignId: string, runId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { upload: SeriesUpload; onProgress: (fraction: number) => void }) =>
      uploadSeries(campaignId, runId, input.upload, input.onProgress),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: comparisonKeys.run(campaignId, runId) });
      await queryClient.invalidateQueries({ queryKey: comparisonKeys.list(campaignId) });
    },
  });
}
