// Turns a picked or photographed file into what Equipot keeps: photos scaled down on the tablet
// (a camera's 12 MP JPEG becomes a few hundred kB) and re-encoded as JPEG, which also drops the
// camera's embedded metadata; PDF and CSV files are kept as they are.
import {
  attachmentContentType,
  attachmentLimits,
  type AttachmentContentType,
} from "../../shared/schemas/attachments";
import { formatBytes } from "./device-storage";

/** The longest side of a kept photo: enough to read a label or a shock indicator. */
export const photoMaxEdgePx = 2048;
const jpegQuality = 0.85;

export interface PreparedFile {
  bytes: ArrayBuffer;
  contentType: AttachmentContentType;
  name: string;
  /** When the file was made, as the device reports it (the moment of the photo for the camera). */
  takenAt: string | null;
}

/** Scales (width, height) down to fit within maxEdge, keeping the aspect; never scales up. */
export function fitWithin(width: number, height: number, maxEdge: number) {
  const scale = Math.min(1, maxEdge / Math.max(width, height));
  return {
    width: Math.max(1, Math.round(width * scale)),
    height: Math.max(1, Math.round(height * scale)),
  };
}

const byExtension: Record<string, AttachmentContentType> = {
  jpg: "image/jpeg",
  jpeg: "image/jpeg",
  png: "image/png",
  webp: "image/webp",
  pdf: "application/pdf",
  csv: "text/csv",
};

/** The accepted type a file claims, by its type or its extension; null when it is not accepted. */
export function claimedType(type: string, name: string): AttachmentContentType | null {
  const direct = attachmentContentType.safeParse(type);
  if (direct.success) return direct.data;
  return byExtension[name.split(".").pop()?.toLowerCase() ?? ""] ?? null;
}

async function reencodePhoto(file: Blob): Promise<Blob | null> {
  let bitmap: ImageBitmap;
  try {
    bitmap = await createImageBitmap(file, { imageOrientation: "from-image" });
  } catch {
    return null;
  }
  const { width, height } = fitWithin(bitmap.width, bitmap.height, photoMaxEdgePx);
  const canvas = document.createElement("canvas");
  canvas.width = width;
  canvas.height = height;
  canvas.getContext("2d")?.drawImage(bitmap, 0, 0, width, height);
  bitmap.close();
  return new Promise((resolve) => canvas.toBlob(resolve, "image/jpeg", jpegQuality));
}

const jpegName = (name: string) => `${name.replace(/\.[^.]*$/, "") || "photo"}.jpg`;

export async function prepareFile(file: File): Promise<PreparedFile> {
  const takenAt = Number.isFinite(file.lastModified)
    ? new Date(file.lastModified).toISOString()
    : null;
  const claimed = claimedType(file.type, file.name);
  const isPhoto = file.type.startsWith("image/") || claimed?.startsWith("image/") === true;
  if (isPhoto) {
    const photo = await reencodePhoto(file);
    if (photo !== null)
      return {
        bytes: await photo.arrayBuffer(),
        contentType: "image/jpeg",
        name: jpegName(file.name),
        takenAt,
      };
    if (claimed === null)
      throw new Error(
        "This photo format cannot be read on this device. Take or save it as JPEG or PNG.",
      );
  }
  if (claimed === null)
    throw new Error("Equipot keeps photos (JPEG, PNG, WebP), PDF and CSV files only.");
  if (file.size > attachmentLimits.maxBytes)
    throw new Error(
      `The file is ${formatBytes(file.size)}; at most ${formatBytes(attachmentLimits.maxBytes)} can be kept.`,
    );
  return { bytes: await file.arrayBuffer(), contentType: claimed, name: file.name, takenAt };
}
