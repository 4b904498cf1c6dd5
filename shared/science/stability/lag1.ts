// Lag-1 autocorrelation of a detrended series and of its differences (Riley & Greenhall 2004,
// eq. 2: r1 = Σ(z_i − z̄)(z_{i+1} − z̄) / Σ(z_i − z̄)²) over valid points and valid pairs (NaN
// marks a gap). The series comes as rows of consecutive values (windows) taken from one long
// series: a single row is the whole series and gives exactly the formula above; several rows
// give the same statistic over the pairs inside the rows.

export interface Lag1 {
  readonly r1: number;
  readonly pairs: number;
}

/** Removes the least-squares line (true series index as abscissa) through the valid values. */
function detrend(starts: Int32Array, values: Float64Array, width: number): Float64Array {
  let n = 0;
  let st = 0;
  let sv = 0;
  let stt = 0;
  let stv = 0;
  for (let r = 0; r < starts.length; r++) {
    for (let j = 0; j < width; j++) {
      const y = values[r * width + j] ?? NaN;
      if (y !== y) continue;
      const x = (starts[r] ?? 0) + j;
      n++;
      st += x;
      sv += y;
      stt += x * x;
      stv += x * y;
    }
  }
  const tm = st / n;
  const vm = sv / n;
  const varT = stt / n - tm * tm;
  const slope = varT > 0 ? (stv / n - tm * vm) / varT : 0;
  const out = new Float64Array(values.length);
  for (let r = 0; r < starts.length; r++) {
    for (let j = 0; j < width; j++) {
      const i = r * width + j;
      out[i] = (values[i] ?? NaN) - vm - slope * ((starts[r] ?? 0) + j - tm);
    }
  }
  return out;
}

/** r1 over the first `len` values of each row. */
function r1Of(w: Float64Array, rows: number, width: number, len: number): Lag1 {
  let n = 0;
  let sum = 0;
  for (let r = 0; r < rows; r++) {
    for (let j = 0; j < len; j++) {
      const v = w[r * width + j] ?? NaN;
      if (v === v) {
        n++;
        sum += v;
      }
    }
  }
  const mean = sum / n;
  let num = 0;
  let den = 0;
  let pairs = 0;
  for (let r = 0; r < rows; r++) {
    const base = r * width;
    let a = (w[base] ?? NaN) - mean;
    for (let j = 0; j < len; j++) {
      const b = j + 1 < len ? (w[base + j + 1] ?? NaN) - mean : NaN;
      if (a === a) {
        den += a * a;
        if (b === b) {
          num += a * b;
          pairs++;
        }
      }
      a = b;
    }
  }
  return { r1: den > 0 ? num / den : 0, pairs };
}

/** Differences each row in place: value j becomes value j+1 − value j (one fewer per row). */
function differenceRows(w: Float64Array, rows: number, width: number, len: number): void {
  for (let r = 0; r < rows; r++) {
    const base = r * width;
    for (let j = 0; j + 1 < len; j++) w[base + j] = (w[base + j + 1] ?? NaN) - (w[base + j] ?? NaN);
  }
}

/** r1 for d = 0 … dmax differences of the detrended rows (stops when rows get too short). */
export function lag1ByDifferences(
  starts: Int32Array,
  values: Float64Array,
  width: number,
  dmax: number,
): Lag1[] {
  const rows = starts.length;
  const w = detrend(starts, values, width);
  const out: Lag1[] = [];
  for (let d = 0; d <= dmax && width - d >= 2; d++) {
    out.push(r1Of(w, rows, width, width - d));
    differenceRows(w, rows, width, width - d);
  }
  return out;
}
