// Normal equations of a levelling network: N = AᵀWA is factorised by ml-matrix's Cholesky
// decomposition; the inverse (cofactor matrix) is then formed from the triangular factor on flat
// typed arrays, because ml-matrix's solve against an identity costs seconds at 500 unknowns.
import { CholeskyDecomposition, Matrix } from "ml-matrix";
import { ScienceInputError } from "../errors";

/** Cholesky factor L (row-major, lower) of a symmetric positive definite u×u matrix. */
function factor(normal: Float64Array, u: number): Float64Array {
  const m = new Matrix(u, u);
  for (let i = 0; i < u; i++) for (let j = 0; j < u; j++) m.set(i, j, normal[i * u + j] ?? 0);
  const chol = new CholeskyDecomposition(m);
  if (!chol.isPositiveDefinite()) {
    throw new ScienceInputError(
      "observations",
      "the normal equations are singular: some heights are undetermined",
    );
  }
  const l = chol.lowerTriangularMatrix;
  const out = new Float64Array(u * u);
  for (let i = 0; i < u; i++) for (let j = 0; j <= i; j++) out[i * u + j] = l.get(i, j);
  return out;
}

/** L⁻¹ by forward substitution, column by column (lower, row-major). */
function invertLower(l: Float64Array, u: number): Float64Array {
  const inv = new Float64Array(u * u);
  for (let j = 0; j < u; j++) {
    inv[j * u + j] = 1 / (l[j * u + j] ?? 1);
    for (let i = j + 1; i < u; i++) {
      let s = 0;
      for (let k = j; k < i; k++) s += (l[i * u + k] ?? 0) * (inv[k * u + j] ?? 0);
      inv[i * u + j] = -s / (l[i * u + i] ?? 1);
    }
  }
  return inv;
}

/** N⁻¹ = L⁻ᵀL⁻¹ (symmetric, row-major). */
export function invertNormal(normal: Float64Array, u: number): Float64Array {
  const li = invertLower(factor(normal, u), u);
  const q = new Float64Array(u * u);
  for (let i = 0; i < u; i++) {
    for (let j = 0; j <= i; j++) {
      let s = 0;
      for (let k = i; k < u; k++) s += (li[k * u + i] ?? 0) * (li[k * u + j] ?? 0);
      q[i * u + j] = s;
      q[j * u + i] = s;
    }
  }
  return q;
}
