// The server's byte-level series reading (line splitter, fast row path, upload reader) against
// independent paths on the same text: Node's readline for the line cuts, Number() and Date.parse
// for the fast numbers and times, and the shared createSeriesReader (the browser's preview path,
// fed lines split by a regular expression) for the whole outcome — samples bit for bit, counts,
// τ0, gaps and every error with its line.
import { createInterface } from "node:readline";
import { Readable } from "node:stream";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createSeriesReader, type SeriesFileSummary } from "../../../shared/comparison";
import { fastSample, readFastRow } from "../../../server/services/comparison/fast-row";
import { createLineSplitter } from "../../../server/services/comparison/line-splitter";
import { createUploadReader } from "../../../server/services/comparison/upload-reader";

type Kind = "fractional" | "ratio";

/** Cuts bytes into chunks at the given sizes (cycled), as a socket might deliver them. */
function chunked(bytes: Buffer, sizes: number[]): Buffer[] {
  const out: Buffer[] = [];
  for (let at = 0, k = 0; at < bytes.length; k++) {
    const n = Math.max(1, sizes[k % sizes.length] ?? 1);
    out.push(bytes.subarray(at, at + n));
    at += n;
  }
  return out;
}

function splitLines(chunks: Buffer[]): string[] {
  const lines: string[] = [];
  const splitter = createLineSplitter((buf, start, end, lineNo) => {
    expect(lineNo).toBe(lines.length + 1);
    lines.push(buf.toString("utf8", start, end));
  });
  for (const c of chunks) splitter.push(c);
  splitter.end();
  return lines;
}

async function readlineLines(chunks: Buffer[]): Promise<string[]> {
  const lines: string[] = [];
  const rl = createInterface({ input: Readable.from(chunks), crlfDelay: Infinity });
  for await (const line of rl) lines.push(lines.length === 0 ? line.replace(/^\uFEFF/, "") : line);
  return lines;
}

interface Outcome {
  samples: number[];
  summary: SeriesFileSummary;
}

function readUpload(text: string, sizes: number[], valueKind: Kind = "fractional"): Outcome {
  const samples: number[] = [];
  const reader = createUploadReader({
    valueKind,
    ...(valueKind === "ratio" ? { nominalRatio: "1.5" } : {}),
    onSample: (t, y) => samples.push(t, y),
  });
  const splitter = createLineSplitter((buf, start, end, lineNo) =>
    reader.line(buf, start, end, lineNo),
  );
  for (const c of chunked(Buffer.from(text, "utf8"), sizes)) splitter.push(c);
  splitter.end();
  return { samples, summary: reader.finish() };
}

function readShared(text: string, valueKind: Kind = "fractional"): Outcome {
  const samples: number[] = [];
  const reader = createSeriesReader({
    valueKind,
    ...(valueKind === "ratio" ? { nominalRatio: "1.5" } : {}),
    onSample: (t, y) => samples.push(t, y),
  });
  const lines = text.replace(/^\uFEFF/, "").split(/\r\n|\n|\r/);
  if (lines.at(-1) === "") lines.pop();
  lines.forEach((line, i) => reader.line(line, i + 1));
  return { samples, summary: reader.finish() };
}

const t0 = Date.UTC(2027, 6, 1) / 1000;
const iso = (t: number) => new Date(t * 1000).toISOString().replace(".000Z", "Z");

describe("line splitter", () => {
  it("cuts where readline cuts: LF, CRLF, lone CR, BOM, blank and unterminated lines", async () => {
    const text = "\uFEFFtime,value\r\n\r\na,1\rb,2\n\nc,\u00e9\u4e2d\r\r\nlast";
    for (const sizes of [[1], [2, 3], [5], [1000]]) {
      const chunks = chunked(Buffer.from(text, "utf8"), sizes);
      const expected = await readlineLines(chunks);
      expect(splitLines(chunks)).toEqual(expected);
    }
    expect(splitLines([Buffer.from("a\nb\n")])).toEqual(["a", "b"]);
  });

  it("agrees with readline on any text and any chunking", async () => {
    const piece = fc.constantFrom("a", "1,2", "\n", "\r", "\r\n", " ", "\u00e9", "\uFEFF", "#");
    await fc.assert(
      fc.asyncProperty(
        fc.array(piece, { maxLength: 40 }),
        fc.array(fc.integer({ min: 1, max: 7 }), { minLength: 1, maxLength: 5 }),
        async (pieces, sizes) => {
          const chunks = chunked(Buffer.from(pieces.join(""), "utf8"), sizes);
          expect(splitLines(chunks)).toEqual(await readlineLines(chunks));
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("fast row", () => {
  const layout = { sep: 0x2c, flagColumn: true };
  const read = (line: string, lastT = -Infinity) => {
    const ok = readFastRow(Buffer.from(line, "latin1"), 0, line.length, layout, lastT);
    return ok ? { t: fastSample.t, y: fastSample.y } : null;
  };

  it("reads values exactly as Number() does", () => {
    const text = fc.oneof(
      fc.double({ noNaN: true, min: -1e-12, max: 1e-12 }).map((v) => v.toString()),
      fc
        .tuple(fc.double({ noNaN: true, min: -1e-12, max: 1e-12 }), fc.integer({ min: 0, max: 20 }))
        .map(([v, d]) => v.toExponential(d)),
      fc
        .tuple(
          fc.constantFrom("", "+", "-"),
          fc.stringMatching(/^\d{0,18}$/),
          fc.constantFrom("", "."),
          fc.stringMatching(/^\d{0,18}$/),
          fc.constantFrom("", "e", "E"),
          fc.constantFrom("", "+", "-"),
          fc.integer({ min: 0, max: 400 }),
        )
        .map(([s, a, p, b, e, es, x]) => `${s}${a}${p}${b}${e === "" ? "" : `${e}${es}${x}`}`),
    );
    fc.assert(
      fc.property(text, (value) => {
        const got = read(`2027-07-01T00:00:00Z,${value}`);
        const plain = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(value);
        const y = Number(value);
        if (plain && Math.abs(y) <= 1e-12) expect(got?.y).toBe(y);
        else expect(got).toBeNull();
      }),
      { numRuns: 5000 },
    );
  });

  it("reads times as Date.parse does, fractions to the digit", () => {
    const when = fc.date({
      min: new Date("1900-01-01T00:00:00Z"),
      max: new Date("2199-12-31T23:59:59Z"),
      noInvalidDate: true,
    });
    fc.assert(
      fc.property(when, fc.stringMatching(/^\d{0,9}$/), (date, digits) => {
        const whole = date.toISOString().slice(0, 19);
        const fraction = digits === "" ? "" : `.${digits}`;
        const got = read(`${whole}${fraction}Z,1e-16`);
        const seconds = Date.parse(`${whole}Z`) / 1000;
        expect(got?.t).toBeCloseTo(seconds + (digits === "" ? 0 : Number(`0.${digits}`)), 6);
        if (digits === "") expect(got?.t).toBe(seconds);
      }),
      { numRuns: 3000 },
    );
  });

  it("declines what only the shared parser may judge", () => {
    for (const line of [
      "2027-07-01T00:00:00+01:00,1e-16", // offset
      "2027-07-01 00:00:00Z,1e-16", // space for T
      "2027-07-01T00:00Z,1e-16", // no seconds
      "2027-02-29T00:00:00Z,1e-16", // not a leap year
      "2028-02-30T00:00:00Z,1e-16",
      "2027-07-01T24:00:00Z,1e-16",
      "2027-07-01T00:00:60Z,1e-16",
      "0050-07-01T00:00:00Z,1e-16", // Date.UTC reads 50 as 1950
      "2027-07-01T00:00:00.1234567890Z,1e-16", // ten fraction digits
      "2027-07-01T00:00:00Z,2e-12", // beyond ±1e-12
      "2027-07-01T00:00:00Z,abc",
      "2027-07-01T00:00:00Z, 1e-16",
      "2027-07-01T00:00:00Z,1e-16,true",
      "2027-07-01T00:00:00Z,1e-16,",
      "2027-07-01T00:00:00Z,1e-16,1,x",
      "2027-07-01T00:00:00Z",
    ])
      expect(read(line), line).toBeNull();
    expect(read("2028-02-29T23:59:59.5Z,-0")).toEqual({
      t: Date.parse("2028-02-29T23:59:59Z") / 1000 + 0.5,
      y: -0,
    });
    expect(read("2027-07-01T00:00:00Z,abc,0")).toBeNull();
    expect(Number.isNaN(read("2027-07-01T00:00:00Z,1e-16,0")?.y)).toBe(true);
    // Not after the previous row: left to the shared parser's message.
    expect(read("2027-07-01T00:00:00Z,1e-16", t0)).toBeNull();
  });
});

describe("upload reader", () => {
  it("matches the shared reader on a file with CRLF, BOM, blank lines and bad rows", () => {
    const lines = ["# remote − reference", "time,value,valid"];
    for (let i = 0; i < 3000; i++)
      lines.push(`${iso(t0 + i)},${(1e-16 * (i % 7)).toExponential(6)},1`);
    lines[500] = `${iso(t0 + 497)},1e-16,1`; // not after the previous row
    lines[900] = `${iso(t0 + 898)}+00:00,abc,1`;
    lines[1200] = "";
    lines[1201] = "   ";
    lines[1500] = `${iso(t0 + 1498)},5e-16,0`;
    lines[2000] = `${iso(t0 + 1998).replace("Z", "+01:00")},1e-16`; // an hour back
    lines.push("2027-07-01T00:5"); // truncated last line, no line break
    const text = "\uFEFF" + lines.join("\r\n");
    const expected = readShared(text);
    expect(expected.summary.badRows).toBe(4);
    expect(expected.summary.errors.map((e) => e.line)).toEqual([501, 901, 2001, 3003]);
    for (const sizes of [[1 << 16], [7, 13, 1], [100]])
      expect(readUpload(text, sizes)).toEqual(expected);
  });

  it("matches the shared reader on good files: samples bit for bit, gaps, flags, offsets", () => {
    const lines = ["timestamp;y;flag"];
    let t = t0;
    for (let i = 0; i < 5000; i++) {
      t += i % 997 === 0 ? 60 : 1; // gaps
      const y = ((i % 13) - 6) * 1.234567e-17;
      if (i % 101 === 0) lines.push(`${iso(t).replace("Z", "+00:00")};${y};1`);
      else if (i % 103 === 0) lines.push(`${iso(t)};${y};0`);
      else lines.push(`${iso(t).replace("Z", ".25Z")};${y}`);
    }
    const text = lines.join("\n") + "\n";
    const expected = readShared(text);
    expect(expected.summary.badRows).toBe(0);
    expect(expected.summary.gaps.count).toBeGreaterThan(0);
    expect(readUpload(text, [4096])).toEqual(expected);
    // A ratio file goes the shared way throughout and still agrees.
    const ratio = ["time,ratio", ...Array.from({ length: 50 }, (_, i) => `${iso(t0 + i)},1.5`)];
    expect(readUpload(ratio.join("\n"), [64], "ratio")).toEqual(
      readShared(ratio.join("\n"), "ratio"),
    );
  });

  it("matches the shared reader on random files of good and bad rows", () => {
    const row = fc.record({
      step: fc.constantFrom(1, 1, 1, 1, 0, -1, 2, 0.5, 30),
      value: fc.oneof(
        fc.double({ noNaN: true, min: -2e-12, max: 2e-12 }).map(String),
        fc.constantFrom("abc", "", "1e", ".5e-16", "+1.", "-0", "1e-16 ", "NaN"),
      ),
      form: fc.constantFrom("z", "z", "z", "frac", "offset", "space", "nosec", "pad"),
      flag: fc.constantFrom(null, null, "1", "0", "true", "", "2"),
      end: fc.constantFrom("\n", "\n", "\r\n", "\r"),
      extra: fc.constantFrom(null, null, null, null, "", "# note", "   "),
    });
    const header = fc.constantFrom(
      null,
      "time,value",
      "time,value,valid",
      "time;y;ok",
      "utc\tvalue",
      '"time","value"',
      "value,time",
      "time,valid",
      "time,value,other",
      "mjd,value",
    );
    fc.assert(
      fc.property(
        header,
        fc.array(row, { maxLength: 60 }),
        fc.boolean(),
        fc.array(fc.integer({ min: 1, max: 50 }), { minLength: 1, maxLength: 4 }),
        (head, rows, bom, sizes) => {
          const sep = head?.includes(";") ? ";" : head?.includes("\t") ? "\t" : ",";
          let t = t0;
          let text = (bom ? "\uFEFF" : "") + (head === null ? "" : `${head}\n`);
          for (const r of rows) {
            t += r.step;
            const whole = iso(Math.floor(t)).replace("Z", "");
            const time =
              r.form === "frac"
                ? `${whole}.${String(t % 1).slice(2, 5) || "0"}Z`
                : r.form === "offset"
                  ? `${whole}+00:00`
                  : r.form === "space"
                    ? `${whole.replace("T", " ")}Z`
                    : r.form === "nosec"
                      ? `${whole.slice(0, 16)}Z`
                      : r.form === "pad"
                        ? ` ${whole}Z `
                        : `${whole}Z`;
            const cells = [time, r.value, ...(r.flag === null ? [] : [r.flag])];
            text += cells.join(sep) + r.end;
            if (r.extra !== null) text += r.extra + r.end;
          }
          expect(readUpload(text, sizes)).toEqual(readShared(text));
        },
      ),
      { numRuns: 400 },
    );
  });
});
