// The common row of a series file read straight from its bytes: `YYYY-MM-DDTHH:MM:SS[.f…]Z`, the
// separator, a plain decimal number, and (where the layout has one) a flag `1` or `0`. Anything
// else — spaces, offsets, other flags, out-of-range fields, a value the shared reader would
// refuse — is declined, and the caller hands the line to the shared parser, which has the final
// word and the error message. An accepted row yields exactly the doubles the shared parser
// would: whole seconds are integers, the fraction is digits / 10^k (one correctly rounded
// division, as Number("0.f…") rounds), and the value is m × 10^e only where both are exact
// doubles (|e| ≤ 22, m < 10^15), else Number() of the text.
import { MAX_ABS_FRACTIONAL } from "../../../shared/comparison";

export interface FastLayout {
  /** The separator byte (`,`, `;` or tab). */
  readonly sep: number;
  /** Whether a third column is the validity flag. */
  readonly flagColumn: boolean;
}

/** The sample of the last accepted row (one object, reused: no allocation per row). */
export const fastSample = { t: 0, y: 0 };

const POW10 = [
  1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17,
  1e18, 1e19, 1e20, 1e21, 1e22,
];
const DAY_S = 86_400;
const ZERO = 0x30;

const digit = (b: number | undefined) =>
  b !== undefined && b >= ZERO && b <= 0x39 ? b - ZERO : -1;

function two(buf: Buffer, at: number): number {
  const a = digit(buf[at]);
  const b = digit(buf[at + 1]);
  return a < 0 || b < 0 ? -1 : a * 10 + b;
}

/** Days from 1970-01-01 to a proleptic Gregorian date (the calendar Date.UTC uses). */
function daysFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const doy = Math.floor((153 * (month + (month > 2 ? -3 : 9)) + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146_097 + doe - 719_468;
}

const MONTH_DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
const leap = (y: number) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;

/** Unix seconds of the time at `at`, or NaN when declined; `timeEnd` receives its end. */
let timeEnd = 0;
function readTime(buf: Buffer, at: number, end: number): number {
  if (end - at < 20) return NaN;
  const c = two(buf, at);
  const yy = two(buf, at + 2);
  const month = two(buf, at + 5);
  const day = two(buf, at + 8);
  const hour = two(buf, at + 11);
  const minute = two(buf, at + 14);
  const second = two(buf, at + 17);
  if (c < 0 || yy < 0 || month < 0 || day < 0 || hour < 0 || minute < 0 || second < 0) return NaN;
  if (buf[at + 4] !== 0x2d || buf[at + 7] !== 0x2d || buf[at + 10] !== 0x54) return NaN; // - - T
  if (buf[at + 13] !== 0x3a || buf[at + 16] !== 0x3a) return NaN; // : :
  const year = c * 100 + yy;
  // Date.UTC reads years 0–99 as 19xx: such files go the shared way.
  if (year < 1900 || month < 1 || month > 12 || day < 1) return NaN;
  if (day > (MONTH_DAYS[month - 1] ?? 0) + (month === 2 && leap(year) ? 1 : 0)) return NaN;
  if (hour > 23 || minute > 59 || second > 59) return NaN;
  let i = at + 19;
  let fraction = 0;
  if (buf[i] === 0x2e) {
    i++;
    let digits = 0;
    let k = 0;
    for (let d = digit(buf[i]); d >= 0 && i < end; d = digit(buf[i])) {
      digits = digits * 10 + d;
      k++;
      i++;
    }
    if (k < 1 || k > 9) return NaN;
    fraction = digits / (POW10[k] ?? NaN);
  }
  const zone = buf[i];
  if (i >= end || (zone !== 0x5a && zone !== 0x7a)) return NaN; // Z or z
  timeEnd = i + 1;
  return daysFromCivil(year, month, day) * DAY_S + hour * 3600 + minute * 60 + second + fraction;
}

/** A plain decimal number between at and end, or NaN when declined. */
function readNumber(buf: Buffer, at: number, end: number): number {
  let i = at;
  let negative = false;
  if (buf[i] === 0x2b || buf[i] === 0x2d) {
    negative = buf[i] === 0x2d;
    i++;
  }
  let mantissa = 0;
  let significant = 0;
  let intDigits = 0;
  let fracDigits = 0;
  for (let d = digit(buf[i]); i < end && d >= 0; d = digit(buf[i])) {
    if (mantissa !== 0 || d !== 0) significant++;
    mantissa = mantissa * 10 + d;
    intDigits++;
    i++;
  }
  if (i < end && buf[i] === 0x2e) {
    i++;
    for (let d = digit(buf[i]); i < end && d >= 0; d = digit(buf[i])) {
      if (mantissa !== 0 || d !== 0) significant++;
      mantissa = mantissa * 10 + d;
      fracDigits++;
      i++;
    }
  }
  if (intDigits + fracDigits === 0) return NaN;
  let exponent = 0;
  if (i < end && (buf[i] === 0x65 || buf[i] === 0x45)) {
    i++;
    let expNegative = false;
    if (buf[i] === 0x2b || buf[i] === 0x2d) {
      expNegative = buf[i] === 0x2d;
      i++;
    }
    let expDigits = 0;
    for (let d = digit(buf[i]); i < end && d >= 0; d = digit(buf[i])) {
      exponent = exponent * 10 + d;
      expDigits++;
      i++;
    }
    if (expDigits === 0 || expDigits > 4) return NaN;
    if (expNegative) exponent = -exponent;
  }
  if (i !== end) return NaN;
  const e10 = exponent - fracDigits;
  // Number() of the text (sign included) where one exact operation cannot give the double.
  if (significant > 15 || e10 > 22 || e10 < -22) return Number(buf.toString("latin1", at, end));
  const magnitude =
    e10 === 0
      ? mantissa
      : e10 > 0
        ? mantissa * (POW10[e10] ?? NaN)
        : mantissa / (POW10[-e10] ?? NaN);
  return negative ? -magnitude : magnitude;
}

/**
 * Reads the row between start and end into fastSample; false when declined (including a time not
 * after lastT and a value the shared parser would refuse).
 */
export function readFastRow(
  buf: Buffer,
  start: number,
  end: number,
  layout: FastLayout,
  lastT: number,
): boolean {
  const t = readTime(buf, start, end);
  if (!(t > lastT) || buf[timeEnd] !== layout.sep) return false;
  const valueStart = timeEnd + 1;
  let valueEnd = valueStart;
  while (valueEnd < end && buf[valueEnd] !== layout.sep) valueEnd++;
  let valid = true;
  if (valueEnd < end) {
    // A third column: only a flag 1 or 0 that ends the line.
    if (!layout.flagColumn || valueEnd + 2 !== end) return false;
    const flag = buf[valueEnd + 1];
    if (flag === 0x30) valid = false;
    else if (flag !== 0x31) return false;
  }
  const y = readNumber(buf, valueStart, valueEnd);
  if (!(Math.abs(y) <= MAX_ABS_FRACTIONAL)) return false;
  fastSample.t = t;
  fastSample.y = valid ? y : NaN;
  return true;
}
