// What the engine needs from the network; the HTTP version lives in http-transport.ts, tests use fakes.
import type { AttachmentContentType } from "../../shared/schemas/attachments";
import type { PullResponse, PushRequest, PushResponse } from "../../shared/sync/protocol";

export interface PullParams {
  campaign: string;
  clientId: string;
  cursor: number;
  limit: number;
  /** The lowest mutation id still in the outbox, so the last page names refusals from there on. */
  pendingFrom?: number;
}

export interface FileUpload {
  campaignId: string;
  sha256: string;
  contentType: AttachmentContentType;
  name: string;
  bytes: ArrayBuffer;
}

export interface FileTransport {
  /** True when the server already holds these bytes for the campaign (nothing to send). */
  exists: (campaignId: string, sha256: string) => Promise<boolean>;
  /** Resolves once the server stored the bytes and checked their hash. */
  upload: (file: FileUpload, onProgress: (sentBytes: number) => void) => Promise<void>;
}

export interface SyncTransport {
  push: (request: PushRequest) => Promise<PushResponse>;
  pull: (params: PullParams) => Promise<PullResponse>;
  files?: FileTransport;
}

/** A failure the engine explains to the crew in plain words. */
export class SyncError extends Error {
  constructor(
    message: string,
    readonly kind: "offline" | "signed-out" | "update-required" | "server" | "refused",
  ) {
    super(message);
  }
}
