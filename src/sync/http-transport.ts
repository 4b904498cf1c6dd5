// The sync transport over the app's API client; failures become SyncErrors in the crew's words.
import type { z } from "zod";
import { protocolVersion, pullResponse, pushResponse } from "../../shared/sync/protocol";
import { ApiError, fileStorageMessageOf } from "../lib/api-error";
import { SyncError, type FileTransport, type SyncTransport } from "./transport";

type Request = <S extends z.ZodType>(
  path: string,
  options: { method?: "GET" | "POST"; body?: unknown; schema: S },
) => Promise<z.output<S>>;

function explain(error: unknown): SyncError {
  if (!(error instanceof ApiError))
    return new SyncError(
      "Sync failed unexpectedly. Your changes are safe on this device.",
      "server",
    );
  if (error.isNetwork)
    return new SyncError(
      "No connection to the server. Your changes are safe on this device and will be sent later.",
      "offline",
    );
  if (error.status === 401)
    return new SyncError(
      "You are signed out. Sign in again to send your changes; they are safe on this device.",
      "signed-out",
    );
  if (error.code === "update_required") return new SyncError(error.message, "update-required");
  if (error.status >= 500)
    return new SyncError(
      "The server had a problem. Your changes are safe on this device; sync will try again.",
      "server",
    );
  return new SyncError(error.message, "refused");
}

/** Refusals a file will always get (type, size, role); anything else is worth another try. */
const refusedForGood = new Set([403, 413, 415]);

function explainFile(error: unknown): SyncError {
  if (error instanceof ApiError && refusedForGood.has(error.status))
    return new SyncError(error.message, "refused");
  // The server's storage is full or out of reach: say so, the bytes wait on the tablet.
  const storage = fileStorageMessageOf(error);
  if (storage !== null) return new SyncError(storage, "server");
  if (error instanceof ApiError && error.status === 400)
    return new SyncError(`A file was not accepted this time: ${error.message}`, "server");
  return explain(error);
}

export function createHttpTransport(request: Request, fileCalls?: FileTransport): SyncTransport {
  return {
    files: fileCalls && {
      async exists(campaignId, sha256) {
        try {
          return await fileCalls.exists(campaignId, sha256);
        } catch (error) {
          throw explainFile(error);
        }
      },
      async upload(file, onProgress) {
        try {
          await fileCalls.upload(file, onProgress);
        } catch (error) {
          throw explainFile(error);
        }
      },
    },
    async push(body) {
      try {
        return await request("/sync/push", { method: "POST", body, schema: pushResponse });
      } catch (error) {
        throw explain(error);
      }
    },
    async pull({ campaign, clientId, cursor, limit, pendingFrom }) {
      const query = new URLSearchParams({
        protocolVersion: String(protocolVersion),
        campaign,
        clientId,
        cursor: String(cursor),
        limit: String(limit),
      });
      if (pendingFrom !== undefined) query.set("pendingFrom", String(pendingFrom));
      try {
        return await request(`/sync/pull?${query.toString()}`, { schema: pullResponse });
      } catch (error) {
        throw explain(error);
      }
    },
  };
}
