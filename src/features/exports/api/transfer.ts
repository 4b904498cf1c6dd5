// Downloads and uploads over XMLHttpRequest, which reports progress (fetch does not), with the
// access token the API client keeps in memory: a plain link would not carry it.
import { env } from "../../../config/env";
import { apiErrorFrom, withAccessToken } from "../../../lib/api";
import { ApiError } from "../../../lib/api-error";
import { reportReachable } from "../../../lib/connectivity";

/** Bytes moved so far and the total when the server said it. */
export interface TransferProgress {
  loaded: number;
  total: number | null;
}

interface Answer {
  status: number;
  body: Blob;
  fileName: string | null;
}

interface SendOptions {
  method: "GET" | "POST";
  path: string;
  body?: Blob;
  contentType?: string;
  onProgress: (progress: TransferProgress) => void;
}

const fileNameIn = (header: string | null) => /filename="([^"]+)"/.exec(header ?? "")?.[1] ?? null;

function send(options: SendOptions, headers: Record<string, string>): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(options.method, `${env.apiBase}${options.path}`);
    xhr.responseType = "blob";
    for (const [name, value] of Object.entries(headers)) xhr.setRequestHeader(name, value);
    if (options.contentType) xhr.setRequestHeader("Content-Type", options.contentType);
    const report = (event: ProgressEvent) =>
      options.onProgress({
        loaded: event.loaded,
        total: event.lengthComputable ? event.total : null,
      });
    if (options.method === "GET") xhr.onprogress = report;
    else xhr.upload.onprogress = report;
    xhr.onload = () => {
      reportReachable(true);
      const body = xhr.response instanceof Blob ? xhr.response : new Blob([]);
      resolve({
        status: xhr.status,
        body,
        fileName: fileNameIn(xhr.getResponseHeader("Content-Disposition")),
      });
    };
    xhr.onerror = () => {
      reportReachable(false);
      reject(ApiError.network(new Error("transfer failed")));
    };
    xhr.send(options.body ?? null);
  });
}

async function errorOf(answer: Answer): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = JSON.parse(await answer.body.text()) as unknown;
  } catch {
    // Not JSON: the status says enough.
  }
  return apiErrorFrom(answer.status, body);
}

/** Sends the request (refreshing the token once on 401) and returns the answer's bytes. */
export async function transfer(
  options: SendOptions,
): Promise<{ blob: Blob; fileName: string | null }> {
  const answer = await withAccessToken((headers) => send(options, headers));
  if (answer.status < 200 || answer.status >= 300) throw await errorOf(answer);
  return { blob: answer.body, fileName: answer.fileName };
}
