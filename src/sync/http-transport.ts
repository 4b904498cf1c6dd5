// The sync transport over the app's API client; failures become SyncErrors in the crew's words.
import type { z } from "zod";
import { protocolVersion, pullResponse, pushResponse } from "../../shared/sync/protocol";
import { ApiError } from "../lib/api-error";
import { SyncError, type SyncTransport } from "./transport";

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

export function createHttpTransport(request: Request): SyncTransport {
  return {
    async push(body) {
      try {
        return await request("/sync/push", { method: "POST", body, schema: pushResponse });
      } catch (error) {
        throw explain(error);
      }
    },
    async pull({ campaign, clientId, cursor, limit }) {
      const query = new URLSearchParams({
        protocolVersion: String(protocolVersion),
        campaign,
        clientId,
        cursor: String(cursor),
        limit: String(limit),
      });
      try {
        return await request(`/sync/pull?${query.toString()}`, { schema: pullResponse });
      } catch (error) {
        throw explain(error);
      }
    },
  };
}
