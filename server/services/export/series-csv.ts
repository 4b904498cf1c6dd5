// One comparison file's samples as CSV: time (ISO 8601 UTC, to the microsecond), fractional
// frequency, and a validity flag (0 where the sample was flagged invalid, with no value).
import Papa from "papaparse";
import type { JsonRow } from "../../db/repositories/campaign-export";

function isoMicros(unixS: number): string {
  const whole = Math.floor(unixS);
  const micros = Math.round((unixS - whole) * 1e6);
  const carry = micros === 1_000_000 ? 1 : 0;
  const base = new Date((whole + carry) * 1000).toISOString().slice(0, 19);
  const fraction = carry ? 0 : micros;
  return fraction === 0 ? `${base}Z` : `${base}.${String(fraction).padStart(6, "0")}Z`;
}

const numbers = (value: unknown): unknown[] => (Array.isArray(value) ? value : []);

export function seriesCsv(chunks: readonly JsonRow[]): string {
  const data: (string | number)[][] = [];
  for (const chunk of chunks) {
    const times = numbers(chunk.times);
    const values = numbers(chunk.values);
    times.forEach((t, i) => {
      const y = values[i];
      const valid = typeof y === "number";
      data.push([typeof t === "number" ? isoMicros(t) : "", valid ? y : "", valid ? 1 : 0]);
    });
  }
  return Papa.unparse({ fields: ["time", "value", "valid"], data }, { newline: "\r\n" });
}
