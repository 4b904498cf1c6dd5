// Reading a QR code out of pixels: camera frames and photos go through the same jsqr call.
import jsQR from "jsqr";

/** Large photos are scaled to this longest side first: jsqr's time grows with the pixels. */
const maxSide = 1600;

export function decodeFrame(
  canvas: HTMLCanvasElement,
  source: CanvasImageSource,
  width: number,
  height: number,
): string | null {
  if (width === 0 || height === 0) return null;
  const scale = Math.min(1, maxSide / Math.max(width, height));
  const w = Math.max(1, Math.round(width * scale));
  const h = Math.max(1, Math.round(height * scale));
  canvas.width = w;
  canvas.height = h;
  const context = canvas.getContext("2d", { willReadFrequently: true });
  if (context === null) return null;
  context.drawImage(source, 0, 0, w, h);
  const pixels = context.getImageData(0, 0, w, h);
  return jsQR(pixels.data, w, h, { inversionAttempts: "attemptBoth" })?.data ?? null;
}

/** Decodes a photo file; null when no code is found, throws when the image cannot be read. */
export async function decodeImageFile(file: Blob): Promise<string | null> {
  const bitmap = await createImageBitmap(file);
  try {
    return decodeFrame(document.createElement("canvas"), bitmap, bitmap.width, bitmap.height);
  } finally {
    bitmap.close();
  }
}
