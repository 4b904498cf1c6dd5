// Times of a comparison series, read to Unix seconds: ISO 8601 with Z or an offset (a time without
// a zone is refused: it could be anyone's local time), or MJD as a decimal number of days.

/** MJD 40587 is 1970-01-01T00:00:00Z. */
const MJD_UNIX_EPOCH = 40587;
const DAY_S = 86_400;
/** MJD accepted: 1970 … 2100 (a Unix-seconds value is far above and is refused). */
export const MJD_RANGE = { min: 40587, max: 88069 } as const;

const ISO =
  /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(\.\d{1,9})?)?(Z|z|[+-]\d{2}(?::?\d{2})?)?$/;
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

export type TimeRead = { ok: true; t: number } | { ok: false; message: string };

const fail = (message: string): TimeRead => ({ ok: false, message });

function offsetS(zone: string): number | null {
  if (zone === "Z" || zone === "z") return 0;
  const sign = zone.startsWith("-") ? -1 : 1;
  const digits = zone.slice(1).replace(":", "");
  const hours = Number(digits.slice(0, 2));
  const minutes = digits.length > 2 ? Number(digits.slice(2, 4)) : 0;
  if (hours > 23 || minutes > 59) return null;
  return sign * (hours * 3600 + minutes * 60);
}

const daysIn = (year: number, month: number) => new Date(Date.UTC(year, month, 0)).getUTCDate();

export function readIsoTime(text: string): TimeRead {
  const m = ISO.exec(text);
  if (m === null) return fail(`"${text}" is not an ISO 8601 time (e.g. 2026-03-01T12:00:00Z)`);
  const [year, month, day, hour, minute] = [m[1], m[2], m[3], m[4], m[5]].map(Number) as [
    number,
    number,
    number,
    number,
    number,
  ];
  const second = Number(m[6] ?? "0");
  const zone = m[8];
  if (zone === undefined) {
    return fail(`"${text}" has no time zone: add Z for UTC or an offset such as +01:00`);
  }
  if (month < 1 || month > 12 || day < 1 || day > daysIn(year, month)) {
    return fail(`"${text}" is not a calendar date`);
  }
  if (hour > 23 || minute > 59 || second > 59) {
    return fail(`"${text}" is not a time of day (a leap second cannot be held in Unix time)`);
  }
  const offset = offsetS(zone);
  if (offset === null) return fail(`"${text}" has an offset beyond ±23:59`);
  const fraction = m[7] === undefined ? 0 : Number(`0${m[7]}`);
  return {
    ok: true,
    t: Date.UTC(year, month - 1, day, hour, minute, second) / 1000 + fraction - offset,
  };
}

export function readMjdTime(text: string): TimeRead {
  if (!NUMBER.test(text)) return fail(`"${text}" is not an MJD (a decimal number of days)`);
  const mjd = Number(text);
  if (!(mjd >= MJD_RANGE.min && mjd <= MJD_RANGE.max)) {
    return fail(
      `MJD ${text} is outside ${MJD_RANGE.min} … ${MJD_RANGE.max} (1970 … 2100; Unix seconds are not accepted)`,
    );
  }
  return { ok: true, t: (mjd - MJD_UNIX_EPOCH) * DAY_S };
}

/** An ISO time when it looks like one (has a '-' after the year), else an MJD. */
export function readAnyTime(text: string): TimeRead {
  return /^\d{4}-/.test(text) ? readIsoTime(text) : readMjdTime(text);
}

export function isPlainNumber(text: string): boolean {
  return NUMBER.test(text);
}

/** ISO 8601 in UTC with milliseconds, for Unix seconds. */
export function isoFromUnixS(t: number): string {
  return new Date(Math.round(t * 1000)).toISOString();
}
