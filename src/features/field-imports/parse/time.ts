// Logger times to UTC instants. Three documented formats; anything else is refused, never guessed
// row by row, so a file is read the same way from its first line to its last.
import type { TimeFormat } from "./mapping";

const isoWithOffset =
  /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?\s?(Z|[+-]\d{2}(?::?\d{2})?)$/i;
const localTime = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?$/;
const unixSeconds = /^\d{1,12}(?:[.,]\d{1,9})?$/;

/** Instants outside this span come from an unset logger clock or milliseconds read as seconds. */
const earliestMs = Date.UTC(1990, 0, 1);
const latestMs = Date.UTC(2100, 0, 1);

export type TimeResult = { ok: true; ms: number } | { ok: false; reason: string };

function offsetMinutes(zone: string): number {
  if (zone.toUpperCase() === "Z") return 0;
  const sign = zone.startsWith("-") ? -1 : 1;
  const digits = zone.slice(1).replace(":", "");
  return sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2) || "0"));
}

/** Wall-clock fields to UTC ms, refusing dates that do not exist (2026-02-30, 24:00). */
function fromFields(m: RegExpExecArray, offsetMin: number): number | null {
  const [year, month, day, hour, minute] = [1, 2, 3, 4, 5].map((i) => Number(m[i]));
  const second = Number(m[6] ?? "0");
  const fraction = Number(`0.${m[7] ?? "0"}`);
  const ms = Date.UTC(year ?? 0, (month ?? 1) - 1, day, hour, minute, second);
  const check = new Date(ms);
  if (
    check.getUTCMonth() !== (month ?? 1) - 1 ||
    check.getUTCDate() !== day ||
    check.getUTCHours() !== hour ||
    check.getUTCMinutes() !== minute ||
    second > 59
  )
    return null;
  return ms + Math.round(fraction * 1000) - offsetMin * 60_000;
}

export function parseTime(text: string, format: TimeFormat, utcOffsetMinutes: number): TimeResult {
  const v = text.trim();
  let ms: number | null;
  if (format === "iso") {
    const m = isoWithOffset.exec(v);
    if (m === null) return { ok: false, reason: "is not an ISO 8601 time with an offset" };
    ms = fromFields(m, offsetMinutes(m[8] ?? "Z"));
  } else if (format === "local") {
    const m = localTime.exec(v);
    if (m === null) return { ok: false, reason: 'is not a "YYYY-MM-DD HH:mm:ss" time' };
    ms = fromFields(m, utcOffsetMinutes);
  } else {
    if (!unixSeconds.test(v)) return { ok: false, reason: "is not a Unix time in seconds" };
    ms = Math.round(Number(v.replace(",", ".")) * 1000);
  }
  if (ms === null) return { ok: false, reason: "is not a date that exists" };
  if (ms < earliestMs || ms >= latestMs)
    return {
      ok: false,
      reason: `gives ${new Date(ms).toISOString().slice(0, 10)}, outside 1990–2099 (is the logger's clock set, and the format right?)`,
    };
  return { ok: true, ms };
}

/** "+02:00" for 120. */
export function formatOffset(minutes: number): string {
  const sign = minutes < 0 ? "−" : "+";
  const abs = Math.abs(minutes);
  return `${sign}${String(Math.floor(abs / 60)).padStart(2, "0")}:${String(abs % 60).padStart(2, "0")}`;
}
