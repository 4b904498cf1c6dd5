// Attachments are content-addressed: the URL names the SHA-256 of the bytes, recomputed by the server.
import { z } from "zod";
import { hasNul, nulMessage } from "./text";

export const attachmentLimits = {
  /** Largest accepted file; the client checks this before sending. */
  maxBytes: 25 * 1024 * 1024,
  /** Display names are cut to this many characters. */
  nameMax: 200,
  /**
   * Largest image by its header: 64 megapixels is above any tablet or phone camera, while a
   * "pixel flood" file (a few kB claiming 10⁹ pixels) would take gigabytes to decode on a tablet.
   */
  maxImagePixels: 64_000_000,
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

/** What a photo or file can be attached to; later entities add their kind here. */
export const attachmentSubjectKinds = [
  "site",
  "checklistRun",
  "fieldEntry",
  "levellingSection",
  "handover",
] as const;
export const attachmentSubjectKind = z.enum(attachmentSubjectKinds);
export type AttachmentSubjectKind = z.infer<typeof attachmentSubjectKind>;

export const captionMax = 500;

/** A file attached to a record: the bytes are addressed by hash, the link syncs like any entity. */
export const attachmentLinkInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  sha256: sha256Hex,
  contentType: attachmentContentType,
  sizeBytes: z
    .number()
    .int()
    .min(1, "sizeBytes must be at least 1")
    .max(attachmentLimits.maxBytes, `sizeBytes must be at most ${attachmentLimits.maxBytes}`),
  name: z
    .string()
    .trim()
    .max(attachmentLimits.nameMax)
    .refine((v) => !hasNul(v), nulMessage("name"))
    .default(""),
  subject: z.strictObject({ kind: attachmentSubjectKind, id: z.uuid("subject.id must be a UUID") }),
  caption: z
    .string()
    .trim()
    .max(captionMax, `Caption must be at most ${captionMax} characters`)
    .refine((v) => !hasNul(v), nulMessage("Caption"))
    .default(""),
  takenAt: z.iso.datetime({ offset: true }).nullable().default(null),
});
export type AttachmentLinkInput = z.input<typeof attachmentLinkInput>;

export const attachmentLinkView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  sha256: sha256Hex,
  contentType: attachmentContentType,
  sizeBytes: z.number().int(),
  name: z.string(),
  subject: z.object({ kind: attachmentSubjectKind, id: z.uuid() }),
  caption: z.string(),
  takenAt: z.string().nullable(),
  createdAt: z.string(),
  createdBy: z.uuid().nullable(),
  removedAt: z.string().nullable(),
});
export type AttachmentLinkView = z.infer<typeof attachmentLinkView>;
