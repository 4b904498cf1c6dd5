// File bytes to and from the server: HEAD to skip what it has, PUT with upload progress (fetch
// cannot report it, XMLHttpRequest can), GET for viewing on another device.
import { attachmentNameHeader } from "../../shared/schemas/attachments";
import { env } from "../config/env";
import { apiErrorFrom, reachServer, withAccessToken } from "./api";
import { ApiError } from "./api-error";
import { reportReachable } from "./connectivity";

const pathOf = (campaignId: string, sha256: string) =>
  `/campaigns/${encodeURIComponent(campaignId)}/attachments/${sha256}`;

/** True when the server holds these bytes for the campaign. */
export async function attachmentExists(campaignId: string, sha256: string): Promise<boolean> {
  const response = await withAccessToken((headers) =>
    reachServer(pathOf(campaignId, sha256), { method: "HEAD", headers, cache: "no-store" }),
  );
  if (response.ok) return true;
  if (response.status === 404) return false;
  throw apiErrorFrom(response.status, undefined);
}

export async function fetchAttachment(campaignId: string, sha256: string): Promise<ArrayBuffer> {
  const response = await withAccessToken((headers) =>
    reachServer(pathOf(campaignId, sha256), { headers }),
  );
  if (!response.ok) throw apiErrorFrom(response.status, await response.json().catch(() => null));
  return response.arrayBuffer();
}

export interface AttachmentUpload {
  campaignId: string;
  sha256: string;
  name: string;
  bytes: ArrayBuffer;
}

function put(
  file: AttachmentUpload,
  headers: Record<string, string>,
  onProgress: (sentBytes: number) => void,
): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("PUT", `${env.apiBase}${pathOf(file.campaignId, file.sha256)}`);
    for (const [name, value] of Object.entries(headers)) xhr.setRequestHeader(name, value);
    // The server decides the type from the bytes; octet-stream keeps the JSON parser away.
    xhr.setRequestHeader("Content-Type", "application/octet-stream");
    xhr.setRequestHeader(attachmentNameHeader, encodeURIComponent(file.name));
    xhr.upload.onprogress = (event) => onProgress(event.loaded);
    xhr.onload = () => {
      reportReachable(true);
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText) as unknown;
      } catch {
        // An empty or non-JSON answer: the status says enough.
      }
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () => {
      reportReachable(false);
      reject(ApiError.network(new Error("upload failed")));
    };
    xhr.send(file.bytes);
  });
}

/** Resolves when the server stored the bytes and found the hash right. */
export async function uploadAttachment(
  file: AttachmentUpload,
  onProgress: (sentBytes: number) => void,
): Promise<void> {
  const result = await withAccessToken((headers) => put(file, headers, onProgress));
  if (result.status !== 200 && result.status !== 201)
    throw apiErrorFrom(result.status, result.body);
}
