// The data sets of NIST SP 1065 (Riley 2008) §12.3 and §12.4, as REFERENCES.md §1 describes them.

/** NBS Monograph 140 fractional-frequency data, τ0 = 1. */
export const NBS_140_FREQUENCY = [892, 809, 823, 798, 671, 644, 883, 903, 677] as const;

/** The same data in phase form (running sum of y − mean), as printed. */
export const NBS_140_PHASE = [
  0, 103.11111, 123.22222, 157.33333, 166.44444, 48.55555, -96.33333, -2.22222, 111.88889, 0,
] as const;

/** The 1000-point set: n0 = 1234567890, n(i+1) = 16807·n(i) mod 2147483647, y(i) = n(i)/2147483647. */
export function sp1065ThousandPoints(): Float64Array {
  const y = new Float64Array(1000);
  let n = 1234567890;
  for (let i = 0; i < y.length; i++) {
    y[i] = n / 2147483647;
    n = (16807 * n) % 2147483647;
  }
  return y;
}
