import { z } from "zod";

export const errorCodes = [
  "bad_request",
  "validation_failed",
  "unauthenticated",
  "forbidden",
  "not_found",
  "conflict",
  "payload_too_large",
  "too_many_requests",
  "unavailable",
  "storage_full",
  "update_required",
  "invalid_file",
  "internal",
] as const;
export type ErrorCode = (typeof errorCodes)[number];

export const fieldIssue = z.object({ path: z.string(), message: z.string() });
export type FieldIssue = z.infer<typeof fieldIssue>;

export const fileRowIssue = z.looseObject({
  row: z.number().int().optional(),
  line: z.number().int().optional(),
  field: z.string(),
  message: z.string(),
});
export type FileRowIssue = z.infer<typeof fileRowIssue>;

export const errorBody = z.object({
  error: z.object({
    code: z.enum(errorCodes),
    message: z.string(),
    details: z.array(fieldIssue).optional(),
    /** A refused file (invalid_file): its bad rows, by row or line number. */
    rows: z.array(fileRowIssue).optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBody>;
