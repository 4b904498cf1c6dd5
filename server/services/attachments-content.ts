// What an upload is, decided from its bytes; and the name it may be shown under.
import { fileTypeFromBuffer } from "file-type";
import { imageSize } from "image-size";
import {
  attachmentContentTypes,
  attachmentLimits,
  type AttachmentContentType,
} from "../../shared/schemas/attachments";
import { HttpError } from "../http-errors";

const accepted = "JPEG, PNG or WebP images, PDF documents and CSV text";
const binaryTypes: readonly AttachmentContentType[] = [
  "image/jpeg",
  "image/png",
  "image/webp",
  "application/pdf",
];

export const unsupportedType = (message: string) =>
  new HttpError(415, "bad_request", `${message}. Accepted: ${accepted}.`);

const isAccepted = (type: string): type is AttachmentContentType =>
  attachmentContentTypes.some((t) => t === type);
const isBinary = (type: string): type is AttachmentContentType =>
  binaryTypes.some((t) => t === type);

/** The request's Content-Type without parameters; only octet-stream or an accepted type may be sent. */
export function declaredType(header: string | undefined): AttachmentContentType | undefined {
  const type = header?.split(";")[0]?.trim().toLowerCase();
  if (!type || type === "application/octet-stream") return undefined;
  if (isAccepted(type)) return type;
  throw unsupportedType(
    `Content-Type ${type} is not accepted: send the file as application/octet-stream`,
  );
}

// Served as an attachment with nosniff this would be harmless, but such files have no place here.
const markup = /<(script|svg|html|iframe|object|embed|!doctype|\?xml)|javascript:/i;

function looksLikeMarkupOrScript(head: Buffer): boolean {
  const text = head
    .toString("utf8")
    .replace(/^\uFEFF/, "")
    .trimStart();
  return text.startsWith("<") || text.startsWith("#!") || markup.test(text);
}

export interface Sample {
  head: Buffer;
  utf8Text: boolean;
}

export async function sniffContentType(
  sample: Sample,
  declared: { type?: AttachmentContentType; name: string | null },
): Promise<AttachmentContentType> {
  const detected = await fileTypeFromBuffer(sample.head);
  if (detected) {
    if (isBinary(detected.mime)) {
      if (detected.mime.startsWith("image/")) assertDecodableSize(sample.head);
      return detected.mime;
    }
    throw unsupportedType(`The file's content is ${detected.mime}, which is not accepted`);
  }
  if (!sample.utf8Text)
    throw unsupportedType("The file's type could not be recognised from its content");
  if (looksLikeMarkupOrScript(sample.head))
    throw unsupportedType("The file looks like HTML, SVG or a script, which is not accepted");
  const saysCsv = declared.type === "text/csv" || /\.csv$/i.test(declared.name ?? "");
  if (saysCsv) return "text/csv";
  const claimed = declared.type ?? declared.name ?? "no type";
  throw unsupportedType(
    `The file is plain text but was sent as ${claimed}; text is accepted only as CSV (Content-Type text/csv or a name ending in .csv)`,
  );
}

/**
 * Refuses an image whose header claims more pixels than a tablet could decode. PNG and WebP give
 * their size at the start; a JPEG whose frame header lies past the sampled head is let through
 * (served as an attachment, never decoded by the server).
 */
function assertDecodableSize(head: Buffer): void {
  let size: { width?: number; height?: number };
  try {
    size = imageSize(head);
  } catch {
    return;
  }
  const pixels = (size.width ?? 0) * (size.height ?? 0);
  if (pixels > attachmentLimits.maxImagePixels)
    throw new HttpError(
      413,
      "payload_too_large",
      `The image claims ${size.width} × ${size.height} pixels; at most ${attachmentLimits.maxImagePixels / 1e6} megapixels are accepted`,
    );
}

// Controls and bidirectional overrides (which can disguise an extension) never reach a stored name.
const isUnsafe = (c: number) =>
  c < 0x20 ||
  (c >= 0x7f && c <= 0x9f) ||
  (c >= 0x202a && c <= 0x202e) ||
  (c >= 0x2066 && c <= 0x2069);
const withoutUnsafe = (s: string) =>
  Array.from(s)
    .filter((ch) => !isUnsafe(ch.codePointAt(0) ?? 0))
    .join("");

/** The display name: last path segment only, no controls, no leading dots, ≤ nameMax characters. */
export function sanitiseFileName(raw: string | undefined): string | null {
  if (!raw) return null;
  let name = raw;
  try {
    name = decodeURIComponent(raw);
  } catch {
    // Not percent-encoded: keep it as sent.
  }
  const last = name.normalize("NFC").split(/[/\\]/).pop() ?? "";
  const cleaned = withoutUnsafe(last).trim().replace(/^\.+/, "").trim();
  const cut = Array.from(cleaned).slice(0, attachmentLimits.nameMax).join("");
  return cut || null;
}

const extensions: Record<AttachmentContentType, string> = {
  "image/jpeg": "jpg",
  "image/png": "png",
  "image/webp": "webp",
  "application/pdf": "pdf",
  "text/csv": "csv",
};

/** Content-Disposition with an ASCII fallback and the UTF-8 name (RFC 6266 / 8187). */
export function contentDisposition(
  name: string | null,
  sha256: string,
  type: AttachmentContentType,
): string {
  const display = name ?? `${sha256.slice(0, 12)}.${extensions[type]}`;
  const ascii = display.replace(/[^\x20-\x7e]|["\\]/g, "_");
  const encoded = encodeURIComponent(display).replace(
    /['()*]/g,
    (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`,
  );
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}
