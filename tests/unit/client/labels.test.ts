// The crate code scheme, and an independent check that what we print scans: the code is encoded
// by qrcode and decoded by jsqr (a separate implementation of ISO/IEC 18004), once from qrcode's
// own raster and once from the SVG path the label draws.
import { createRequire } from "node:module";
import jsQR from "jsqr";
import QRCode from "qrcode";
import { describe, expect, test } from "vitest";
import {
  crateCodePrefix,
  crateQrMatrix,
  encodeCrateCode,
  parseCrateCode,
  qrPath,
} from "../../../src/features/labels/crate-code";
import {
  buildMapPoints,
  lastCrateSites,
  pointsBounds,
  pointsToGeoJson,
} from "../../../src/features/map/map-data";
import { readTileUrl, tileUrlKey, writeTileUrl } from "../../../src/features/map/tile-setting";

const require = createRequire(import.meta.url);
// qrcode's raster renderer (the one behind its PNG and canvas output), RGBA into a buffer.
const qrUtils = require("qrcode/lib/renderer/utils") as {
  getOptions: (o: object) => object;
  getImageWidth: (size: number, o: object) => number;
  qrToImageData: (data: Uint8ClampedArray, qr: QRCode.QRCode, o: object) => void;
};

function decodeWithJsqr(rgba: Uint8ClampedArray, width: number): string | null {
  return jsQR(rgba, width, width)?.data ?? null;
}

/** qrcode encodes and renders, jsqr reads. */
function roundTripThroughQrcode(text: string): string | null {
  const qr = QRCode.create(text, { errorCorrectionLevel: "M" });
  const options = qrUtils.getOptions({ scale: 4, margin: 4 });
  const width = qrUtils.getImageWidth(qr.modules.size, options);
  const rgba = new Uint8ClampedArray(width * width * 4);
  qrUtils.qrToImageData(rgba, qr, options);
  return decodeWithJsqr(rgba, width);
}

/** Rasterises our SVG path ("M x y h1v1h-1z" squares) at `scale` px per module. */
function rasterisePath(path: string, modules: number, scale = 4): [Uint8ClampedArray, number] {
  const width = modules * scale;
  const rgba = new Uint8ClampedArray(width * width * 4).fill(255);
  for (const m of path.matchAll(/M(\d+) (\d+)h1v1h-1z/g)) {
    const x0 = Number(m[1]) * scale;
    const y0 = Number(m[2]) * scale;
    for (let y = y0; y < y0 + scale; y++)
      for (let x = x0; x < x0 + scale; x++)
        rgba.fill(0, (y * width + x) * 4, (y * width + x) * 4 + 3);
  }
  return [rgba, width];
}

describe("crate code scheme", () => {
  test.each(["KR-03", "KR-01", "Crate 7 / spare", "Ø-12", "A:1", "x".repeat(40)])(
    "round trip of %j",
    (label) => {
      const code = encodeCrateCode(label);
      expect(code.startsWith(crateCodePrefix)).toBe(true);
      expect(parseCrateCode(code)).toEqual({ ok: true, label });
    },
  );

  test("unreserved characters stay readable in the code", () => {
    expect(encodeCrateCode("KR-03")).toBe("equipot:crate:KR-03");
    expect(encodeCrateCode("Crate 7")).toBe("equipot:crate:Crate%207");
  });

  test("a bare label is accepted, trimmed", () => {
    expect(parseCrateCode("  KR-03 \n")).toEqual({ ok: true, label: "KR-03" });
    expect(parseCrateCode("EQUIPOT:CRATE:KR-03")).toEqual({ ok: true, label: "KR-03" });
  });

  test.each([
    ["", "Label: nothing was read"],
    ["   ", "Label: nothing was read"],
    ["equipot:crate:", "Label: empty"],
    ["equipot:crate:%E0%A4%A", "Label: the code's label is not properly encoded"],
    ["https://example.test/KR-03", "Label: this code is not an Equipot crate label"],
    ["equipot:site:KR-03", "Label: this code is not an Equipot crate label"],
    ["x".repeat(41), "Label: at most 40 characters"],
    ["equipot:crate:KR%0A03", "Label: control characters are not allowed"],
  ])("refuses %j", (text, message) => {
    expect(parseCrateCode(text)).toEqual({ ok: false, message });
  });

  test("encoding refuses a label the scheme cannot carry, naming the field", () => {
    expect(() => encodeCrateCode("")).toThrow("Label: empty");
    expect(() => encodeCrateCode("x".repeat(41))).toThrow("Label: at most 40 characters");
  });
});

describe("the printed code scans (qrcode → jsqr)", () => {
  test.each(["KR-03", "Crate 7 / spare", "Ø-12"])("qrcode's raster of %j", (label) => {
    const decoded = roundTripThroughQrcode(encodeCrateCode(label));
    expect(decoded).toBe(encodeCrateCode(label));
    expect(parseCrateCode(decoded ?? "")).toEqual({ ok: true, label });
  });

  test.each(["KR-03", "KR-05", "Crate 7 / spare"])("the label's SVG path for %j", (label) => {
    const matrix = crateQrMatrix(label);
    const [rgba, width] = rasterisePath(qrPath(matrix, 4), matrix.size + 8);
    expect(parseCrateCode(decodeWithJsqr(rgba, width) ?? "")).toEqual({ ok: true, label });
  });

  test("a blank image is not read as a code (the check can fail)", () => {
    const width = 100;
    expect(decodeWithJsqr(new Uint8ClampedArray(width * width * 4).fill(255), width)).toBeNull();
  });
});

// The map's helpers live here too (this brief owns one unit file); hand-worked examples.
describe("map points", () => {
  const site = (
    id: string,
    name: string,
    lat: number,
    lon: number,
    deletedAt: string | null = null,
  ) => ({
    id,
    name,
    kind: "mountain" as const,
    latitudeDeg: lat,
    longitudeDeg: lon,
    deletedAt,
  });
  const crate = (id: string, label: string) =>
    ({
      id,
      label,
      deletedAt: null,
    }) as unknown as import("../../../shared/schemas/crates").CrateView;
  const entry = (id: string, siteId: string, crateId: string | null, observedAt: string) => ({
    id,
    siteId,
    crateId,
    observedAt,
  });

  test("a crate sits at the site of its most recent entry; ties go to the larger id", () => {
    const entries = [
      entry("e1", "s1", "c1", "2027-05-01T08:00:00Z"),
      entry("e2", "s2", "c1", "2027-05-02T08:00:00Z"),
      entry("e3", "s1", "c2", "2027-05-03T08:00:00Z"),
      entry("e5", "s2", "c2", "2027-05-03T08:00:00Z"),
      entry("e4", "s1", null, "2027-06-01T08:00:00Z"),
    ];
    const last = lastCrateSites([crate("c1", "A"), crate("c2", "B"), crate("c3", "C")], entries);
    expect(Object.fromEntries([...last].map(([k, v]) => [k, v.siteId]))).toEqual({
      c1: "s2",
      c2: "s2",
    });
  });

  test("points: live sites, benchmarks, crates placed at a live site only", () => {
    const points = buildMapPoints({
      sites: [
        site("s1", "Upper hut", 47.1, 11.2),
        site("s2", "Gone", 46, 10, "2027-01-01T00:00:00Z"),
      ],
      benchmarks: [
        {
          id: "b1",
          code: "BM-1",
          description: "Bolt",
          latitudeDeg: 47.2,
          longitudeDeg: 11.3,
        } as unknown as import("../../../shared/schemas/benchmarks").BenchmarkView,
      ],
      crates: [crate("c1", "KR-01"), crate("c2", "KR-02")],
      entries: [
        entry("e1", "s1", "c1", "2027-05-01T08:00:00Z"),
        entry("e2", "s2", "c2", "2027-05-01T08:00:00Z"),
      ],
    });
    expect(points.map((p) => [p.kind, p.name, p.latitudeDeg, p.longitudeDeg])).toEqual([
      ["site", "Upper hut", 47.1, 11.2],
      ["benchmark", "BM-1", 47.2, 11.3],
      ["crate", "KR-01", 47.1, 11.2],
    ]);
    // RFC 7946 §3.1.1: positions are [longitude, latitude].
    expect(pointsToGeoJson(points).features[0]?.geometry.coordinates).toEqual([11.2, 47.1]);
    expect(pointsBounds(points, 0.1)).toEqual([
      [11.2 - 0.1, 47.1 - 0.1],
      [11.3 + 0.1, 47.2 + 0.1],
    ]);
    expect(pointsBounds([])).toBeNull();
  });
});

describe("online tile setting", () => {
  const memory = () => {
    const values = new Map<string, string>();
    return {
      getItem: (k: string) => values.get(k) ?? null,
      setItem: (k: string, v: string) => void values.set(k, v),
      removeItem: (k: string) => void values.delete(k),
    };
  };

  test("off by default, saved when valid, off again when emptied", () => {
    const storage = memory();
    expect(readTileUrl(storage)).toBeNull();
    const url = "https://tiles.example.test/{z}/{x}/{y}.png";
    expect(writeTileUrl(storage, ` ${url} `)).toEqual({ ok: true, url });
    expect(readTileUrl(storage)).toBe(url);
    expect(writeTileUrl(storage, "")).toEqual({ ok: true, url: null });
    expect(readTileUrl(storage)).toBeNull();
  });

  test.each([
    ["http://tiles.example.test/{z}/{x}/{y}.png", "Tile address: must be an https:// address"],
    ["not a url", "Tile address: must be an https:// address"],
    ["https://tiles.example.test/{z}/{x}.png", "Tile address: must contain {z}, {x} and {y}"],
  ])("refuses %j", (value, message) => {
    const storage = memory();
    expect(writeTileUrl(storage, value)).toEqual({ ok: false, message });
    expect(readTileUrl(storage)).toBeNull();
  });

  test("a hand-edited stored value is ignored", () => {
    const storage = memory();
    storage.setItem(tileUrlKey, JSON.stringify({ url: "javascript:alert(1)//{z}{x}{y}" }));
    expect(readTileUrl(storage)).toBeNull();
    storage.setItem(tileUrlKey, "{not json");
    expect(readTileUrl(storage)).toBeNull();
  });
});
