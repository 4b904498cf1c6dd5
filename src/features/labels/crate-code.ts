// What a crate's QR code holds: `equipot:crate:<label>`, the label percent-encoded (RFC 3986
// unreserved characters such as letters, digits and "-" stay as they are, so KR-03 reads as is).
// A scanner also accepts a bare label, for codes printed by hand or typed.
import QRCode from "qrcode";
import { z } from "zod";
import { logisticsLimits } from "../../../shared/schemas/logistics";

export const crateCodePrefix = "equipot:crate:";

/** A crate label as it may appear in a code: 1–40 characters, no control characters. */
export const crateLabelSchema = z
  .string()
  .trim()
  .min(1, "Label: empty")
  .max(logisticsLimits.labelMax, `Label: at most ${logisticsLimits.labelMax} characters`)
  // eslint-disable-next-line no-control-regex
  .refine((s) => !/[\u0000-\u001f\u007f]/.test(s), "Label: control characters are not allowed");

export function encodeCrateCode(label: string): string {
  const parsed = crateLabelSchema.safeParse(label);
  if (!parsed.success) throw new Error(parsed.error.issues[0]?.message ?? "Label: not valid");
  return crateCodePrefix + encodeURIComponent(parsed.data);
}

export type CrateCodeResult = { ok: true; label: string } | { ok: false; message: string };

/** Reads a scanned or typed text: `equipot:crate:<label>` or a bare label. */
export function parseCrateCode(text: string): CrateCodeResult {
  const trimmed = text.trim();
  if (trimmed === "") return { ok: false, message: "Label: nothing was read" };
  let candidate = trimmed;
  if (trimmed.toLowerCase().startsWith(crateCodePrefix)) {
    try {
      candidate = decodeURIComponent(trimmed.slice(crateCodePrefix.length));
    } catch {
      return { ok: false, message: "Label: the code's label is not properly encoded" };
    }
  } else if (trimmed.includes(":")) {
    // Another scheme (a web address, another kind of code). A label with a colon still travels
    // inside the scheme, where the colon is percent-encoded.
    return { ok: false, message: "Label: this code is not an Equipot crate label" };
  }
  const parsed = crateLabelSchema.safeParse(candidate);
  if (!parsed.success)
    return { ok: false, message: parsed.error.issues[0]?.message ?? "Label: not valid" };
  return { ok: true, label: parsed.data };
}

export interface QrMatrix {
  /** Modules per side, without the quiet zone. */
  size: number;
  /** Row-major, true for a dark module. */
  dark: (x: number, y: number) => boolean;
}

/** The code's modules; medium error correction survives a scuffed label. */
export function crateQrMatrix(label: string): QrMatrix {
  const qr = QRCode.create(encodeCrateCode(label), { errorCorrectionLevel: "M" });
  const { size, data } = qr.modules;
  return { size, dark: (x, y) => data[y * size + x] === 1 };
}

/** One SVG path of unit squares, in module coordinates shifted by the quiet zone. */
export function qrPath(matrix: QrMatrix, margin = 4): string {
  const parts: string[] = [];
  for (let y = 0; y < matrix.size; y++)
    for (let x = 0; x < matrix.size; x++)
      if (matrix.dark(x, y)) parts.push(`M${x + margin} ${y + margin}h1v1h-1z`);
  return parts.join("");
}
