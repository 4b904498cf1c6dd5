// Attachments are content-addressed: the URL names the SHA-256 of the bytes, recomputed by the server.
import { z } from "zod";

export const attachmentLimits = {
  /** Largest accepted file; the client checks this before sending. */
  maxBytes: 25 * 1024 * 1024,
  /** Display names are cut to this many characters. */
  nameMax: 200,
} as const;

/** Accepted types, always decided from the bytes (CSV: valid UTF-8 text declared as CSV). */
export const attachmentContentTypes = [
  "image/jpeg",
  "image/png",
  "image/webp",
  "application/pdf",
  "text/csv",
] as const;
export const attachmentContentType = z.enum(attachmentContentTypes);
export type AttachmentContentType = z.infer<typeof attachmentContentType>;

export const sha256Hex = z
  .string({ error: "sha256 is required" })
  .regex(/^[0-9a-f]{64}$/, "sha256 must be 64 lowercase hexadecimal characters");

export const attachmentParams = z.object({ sha256: sha256Hex });

/** Header carrying the file's name for display, percent-encoded UTF-8 (encodeURIComponent). */
export const attachmentNameHeader = "x-file-name";

export const attachmentView = z.object({
  campaignId: z.uuid(),
  sha256: sha256Hex,
  contentType: attachmentContentType,
  sizeBytes: z.number().int().nonnegative(),
  originalName: z.string().nullable(),
  createdBy: z.uuid().nullable(),
  createdAt: z.iso.datetime(),
});
export type AttachmentView = z.infer<typeof attachmentView>;

/** Body of 200/201 after PUT and of GET …/meta. */
export const attachmentResponse = z.object({ attachment: attachmentView });
export type AttachmentResponse = z.infer<typeof attachmentResponse>;
