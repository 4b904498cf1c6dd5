// An optional online raster layer (XYZ tiles) under the bundled outlines, off by default: the map
// must work with no network, and a tile server is the team's own choice. Kept per device.
import { z } from "zod";

export const tileUrlKey = "equipot.mapTiles.v1";

/** https (or http on this machine) with {z}, {x} and {y}, e.g. https://tiles.example.test/{z}/{x}/{y}.png */
export const tileUrlSchema = z
  .string()
  .trim()
  .max(500, "Tile address: at most 500 characters")
  .refine((s) => {
    try {
      const url = new URL(s.replace(/\{[a-z]\}/g, "0"));
      return (
        url.protocol === "https:" ||
        (url.protocol === "http:" && ["localhost", "127.0.0.1"].includes(url.hostname))
      );
    } catch {
      return false;
    }
  }, "Tile address: must be an https:// address")
  .refine(
    (s) => s.includes("{z}") && s.includes("{x}") && s.includes("{y}"),
    "Tile address: must contain {z}, {x} and {y}",
  );

interface StorageLike {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

const stored = z.object({ url: tileUrlSchema });

/** null when unset or unreadable (an old or hand-edited value is ignored, never trusted). */
export function readTileUrl(storage: StorageLike): string | null {
  const raw = storage.getItem(tileUrlKey);
  if (raw === null) return null;
  try {
    const parsed = stored.safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data.url : null;
  } catch {
    return null;
  }
}

/** An empty value turns the layer off. */
export function writeTileUrl(
  storage: StorageLike,
  value: string,
): { ok: true; url: string | null } | { ok: false; message: string } {
  if (value.trim() === "") {
    storage.removeItem(tileUrlKey);
    return { ok: true, url: null };
  }
  const parsed = tileUrlSchema.safeParse(value);
  if (!parsed.success)
    return { ok: false, message: parsed.error.issues[0]?.message ?? "Tile address: not valid" };
  storage.setItem(tileUrlKey, JSON.stringify({ url: parsed.data }));
  return { ok: true, url: parsed.data };
}
