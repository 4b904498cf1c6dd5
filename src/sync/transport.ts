// What the engine needs from the network; the HTTP version lives in http-transport.ts, tests use fakes.
import type { PullResponse, PushRequest, PushResponse } from "../../shared/sync/protocol";

export interface PullParams {
  campaign: string;
  clientId: string;
  cursor: number;
  limit: number;
}

export interface SyncTransport {
  push: (request: PushRequest) => Promise<PushResponse>;
  pull: (params: PullParams) => Promise<PullResponse>;
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
