// y = ratio/nominal − 1 in exact decimal arithmetic. A frequency ratio near 1 is written with 18 or
// more significant digits; a double holds about 16, so ratio/nominal in doubles would lose the
// very digits that carry the height. Both are read as integer × 10^exponent (BigInt), the
// difference is formed exactly and only the final quotient is rounded, once, to a double.

export interface ExactDecimal {
  /** value = mantissa × 10^exponent */
  readonly mantissa: bigint;
  readonly exponent: number;
}

const DECIMAL = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d{1,4}))?$/;

/** Reads a plain or scientific decimal exactly, or null when it is not one. */
export function parseExactDecimal(text: string): ExactDecimal | null {
  const m = DECIMAL.exec(text);
  if (m === null) return null;
  const whole = m[2] ?? "";
  const fraction = m[3] ?? "";
  if (whole.length + fraction.length === 0) return null;
  const digits = BigInt(whole + fraction);
  const exponent = Number(m[4] ?? "0") - fraction.length;
  return { mantissa: m[1] === "-" ? -digits : digits, exponent };
}

const pow10 = (n: number) => 10n ** BigInt(n);
const digitCount = (v: bigint) => (v < 0n ? -v : v).toString().length;

/** Significant digits kept in the quotient before the one rounding to double (17 would do). */
const QUOTIENT_DIGITS = 25;

/** ratio/nominal − 1 rounded once to the nearest double; nominal must be positive. */
export function fractionalFromRatio(ratio: ExactDecimal, nominal: ExactDecimal): number {
  if (nominal.mantissa <= 0n) throw new RangeError("the nominal ratio must be positive");
  const e = Math.min(ratio.exponent, nominal.exponent);
  const numerator =
    ratio.mantissa * pow10(ratio.exponent - e) - nominal.mantissa * pow10(nominal.exponent - e);
  if (numerator === 0n) return 0;
  const denominator = nominal.mantissa * pow10(nominal.exponent - e);
  const k = Math.max(0, QUOTIENT_DIGITS + digitCount(denominator) - digitCount(numerator));
  const quotient = (numerator * pow10(k)) / denominator;
  // Number() of a decimal string rounds correctly; the digits cut off at 25 cannot change it.
  return Number(`${quotient}e-${k}`);
}
