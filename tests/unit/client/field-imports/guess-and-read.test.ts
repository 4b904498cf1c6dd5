// The mapping guessed from headers of several (invented) logger styles, and reading a file in
// slices without breaking a character that straddles two slices.
import { describe, expect, it } from "vitest";
import { guessMapping, headersAt, sniff } from "../../../../src/features/field-imports/parse/guess";
import {
  FileTooLargeError,
  maxFileBytes,
  readFileText,
} from "../../../../src/features/field-imports/parse/read-file";

describe("guessMapping", () => {
  it("finds time, temperature in °F and humidity by name, case-insensitive", () => {
    const text = "DATE/TIME\tTEMP(°F)\t%RH\n2026-06-03 14:05:00\t70.1\t40\n";
    const sniffed = sniff(text);
    expect(sniffed.delimiter).toBe("\t");
    const m = guessMapping("temperatures", sniffed, -300);
    expect(m.time).toEqual({ column: "DATE/TIME", format: "local", utcOffsetMinutes: -300 });
    expect(m.values).toEqual({
      kind: "temperatures",
      temperature: "TEMP(°F)",
      humidity: "%RH",
      temperatureUnit: "degF",
    });
  });

  it("prefers a timestamp column over a plain date and maps accX/accY/accZ and the pulse width", () => {
    const text = "date,timestamp,accX,accY,accZ,width (ms)\n2026-06-03,1780488300,1,2,3,11\n";
    const m = guessMapping("shock-log", sniff(text), 0);
    expect(m.time).toMatchObject({ column: "timestamp", format: "unix-s" });
    expect(m.values).toEqual({
      kind: "shock-log",
      x: "accX",
      y: "accY",
      z: "accZ",
      duration: "width (ms)",
      accelerationUnit: "g",
    });
  });

  it("leaves a column it cannot recognise empty, for the user to choose", () => {
    const m = guessMapping("temperatures", sniff("time,channel 1\n2026-06-03T12:00:00Z,20\n"), 0);
    expect(m.values).toMatchObject({ temperature: "", humidity: null });
  });

  it("reads the header again after the user changes its line or the delimiter", () => {
    const text = "Serial 7\nt;c\n";
    expect(headersAt(text, 2, ";")).toEqual(["t", "c"]);
    expect(headersAt(text, 2, ",")).toEqual(["t;c"]);
  });
});

describe("readFileText", () => {
  it("keeps a two-byte character whole across the 1 MiB slice boundary", async () => {
    const head = "a".repeat(1024 * 1024 - 1);
    const text = `${head}°C\n`;
    const bytes = new TextEncoder().encode(text);
    // "°" is 0xC2 0xB0: its first byte ends the first slice.
    expect(bytes[1024 * 1024 - 1]).toBe(0xc2);
    const seen: number[] = [];
    expect(await readFileText(new Blob([bytes]), (p) => seen.push(p.doneBytes))).toBe(text);
    expect(seen).toEqual([1024 * 1024, bytes.length]);
  });

  it("refuses a file above the limit before reading it", async () => {
    const big = { size: maxFileBytes + 1 } as Blob;
    await expect(readFileText(big)).rejects.toBeInstanceOf(FileTooLargeError);
    await expect(readFileText(big)).rejects.toThrow("at most 20 MB");
  });
});
