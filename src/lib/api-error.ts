import type { ErrorCode, FieldIssue, FileRowIssue } from "../../shared/schemas";

/** Codes of the server's error body, plus two the client makes itself. */
export type ApiErrorCode = ErrorCode | "network" | "bad_response";

/** Every failed API call ends as one of these: the server's error body, typed. */
export class ApiError extends Error {
  override readonly name = "ApiError";

  constructor(
    /** HTTP status; 0 when the server could not be reached at all. */
    readonly status: number,
    readonly code: ApiErrorCode,
    message: string,
    readonly details: readonly FieldIssue[] = [],
    /** A refused file's bad rows (code invalid_file). */
    readonly rows: readonly FileRowIssue[] = [],
  ) {
    super(message);
  }

  static network(cause: unknown): ApiError {
    const error = new ApiError(0, "network", "No connection to the Equipot server.");
    error.cause = cause;
    return error;
  }

  get isNetwork(): boolean {
    return this.code === "network";
  }
}

export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}

/** A refused file's problems, each at its 1-based row or line (0 or less: the whole file). */
export interface RefusedFile {
  message: string;
  rows: { row: number; field: string; message: string }[];
}

/** The refusal when `error` is a 422 invalid_file answer (nothing was stored), otherwise null. */
export function refusedFileOf(error: unknown): RefusedFile | null {
  if (!(error instanceof ApiError) || error.code !== "invalid_file") return null;
  return {
    message: error.message,
    rows: error.rows.map((r) => ({
      row: r.row ?? r.line ?? 0,
      field: r.field,
      message: r.message,
    })),
  };
}

/** IndexedDB refused a write because the browser's storage for this app is used up. */
export function isStorageFull(error: unknown): boolean {
  // Dexie wraps the browser's DOMException as `inner`; either may carry the name.
  let e = error as { name?: unknown; inner?: unknown } | undefined;
  for (let depth = 0; e && depth < 3; depth++) {
    if (e.name === "QuotaExceededError") return true;
    e = e.inner as typeof e;
  }
  return false;
}

export const storageFullMessage =
  "This tablet's storage for Equipot is full, so nothing was saved. What you typed is still here: " +
  "send the waiting changes (Sync now) or free space on the tablet, then save again.";

/** A message a person can read, whatever was thrown. */
export function messageOf(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (isStorageFull(error)) return storageFullMessage;
  if (error instanceof Error && error.message) return error.message;
  return "Something went wrong.";
}

/** A file upload answered 507: the server has no room for the bytes; the tablet keeps them. */
export const serverStorageFullMessage =
  "The server's storage for photos and files is full. Your photo or file is kept on this tablet " +
  "and will be sent at a later sync, once the server has space again. Your other changes are sent.";

/** A file upload answered 503: the server cannot store files right now; the tablet keeps them. */
export const serverStorageUnavailableMessage =
  "The server cannot store photos and files right now. Your photo or file is kept on this " +
  "tablet and will be sent at a later sync. Your other changes are sent.";

/** The crew's words for a file upload the server could not store for now, or null. */
export function fileStorageMessageOf(error: unknown): string | null {
  if (!(error instanceof ApiError)) return null;
  if (error.status === 507 || error.code === "storage_full") return serverStorageFullMessage;
  if (error.status === 503) return serverStorageUnavailableMessage;
  return null;
}
