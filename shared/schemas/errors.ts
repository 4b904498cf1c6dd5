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
  "internal",
] as const;
export type ErrorCode = (typeof errorCodes)[number];

export const fieldIssue = z.object({ path: z.string(), message: z.string() });
export type FieldIssue = z.infer<typeof fieldIssue>;

export const errorBody = z.object({
  error: z.object({
    code: z.enum(errorCodes),
    message: z.string(),
    details: z.array(fieldIssue).optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBody>;
