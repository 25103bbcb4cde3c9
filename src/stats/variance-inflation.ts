/** Variance inflation of each column of a table against the others. */
export interface VarianceInflation {
  /** VIF_k = 1/(1 − R_k²); Infinity when the column is an exact linear function of the others */
  vif: number[];
  /** for each column, the other column it correlates with most (index) and that correlation */
  partner: number[];
  partnerR: number[];
}

// a pivot this small (relative to the diagonal of a correlation matrix, which is 1) means the
// column is a linear function of the others to the precision the correlations carry
const SINGULAR = 1e-10;

/**
 * Variance inflation factors: the diagonal of the inverse correlation matrix, VIF_k = 1/(1 − R_k²)
 * with R_k² from regressing column k on the others. Source: Marquardt, D. W. (1970), Generalized
 * inverses, ridge regression, biased linear estimation, and nonlinear estimation, *Technometrics*
 * 12(3), 591–612; Kutner, Nachtsheim, Neter & Li (2005), *Applied Linear Statistical Models* (5th
 * ed.), §10.5. The inverse by sweeping (see inverseDiagonal); an exact dependence gives VIF Infinity.
 *
 * @param columns k columns of equal length, none constant
 * @returns the VIFs and each column's most correlated partner
 */
export function varianceInflation(columns: readonly (readonly number[])[]): VarianceInflation {
  const k = columns.length;
  const r = correlationMatrix(columns);
  const partner: number[] = [];
  const partnerR: number[] = [];
  for (let i = 0; i < k; i++) {
    let best = -1;
    for (let j = 0; j < k; j++) if (j !== i && (best < 0 || Math.abs(r[i][j]) > Math.abs(r[i][best]))) best = j;
    partner.push(best);
    partnerR.push(best >= 0 ? r[i][best] : NaN);
  }
  return { vif: inverseDiagonal(r), partner, partnerR };
}

/** Pearson correlations of the columns, each centred on its own mean first (two passes, stable). */
function correlationMatrix(columns: readonly (readonly number[])[]): number[][] {
  const centred = columns.map((c) => {
    const m = c.reduce((a, b) => a + b, 0) / c.length;
    return c.map((v) => v - m);
  });
  const norm = centred.map((c) => Math.sqrt(c.reduce((a, b) => a + b * b, 0)));
  return centred.map((a, i) => centred.map((b, j) => (i === j ? 1 : a.reduce((s, v, t) => s + v * b[t], 0) / (norm[i] * norm[j]))));
}

/**
 * The diagonal of the inverse of a correlation matrix by the sweep operator (Goodnight, J. H. 1979,
 * A tutorial on the SWEEP operator, *The American Statistician* 33(3), 149–158): a column whose
 * residual variance given the columns swept before it is below SINGULAR is a linear function of
 * them and is not swept; it, and every swept column with a non-zero coefficient in it, gets Infinity.
 */
function inverseDiagonal(matrix: readonly (readonly number[])[]): number[] {
  const k = matrix.length;
  const a = matrix.map((row) => [...row]);
  const swept = new Array<boolean>(k).fill(false);
  for (let c = 0; c < k; c++) {
    const d = a[c][c];
    if (!(d > SINGULAR)) continue;
    swept[c] = true;
    for (let i = 0; i < k; i++) {
      if (i === c) continue;
      for (let j = 0; j < k; j++) if (j !== c) a[i][j] -= (a[i][c] * a[c][j]) / d;
    }
    for (let i = 0; i < k; i++) {
      if (i === c) continue;
      a[i][c] /= d;
      a[c][i] /= d;
    }
    a[c][c] = -1 / d;
  }
  const dependent = swept.map((s) => !s);
  return a.map((row, i) => {
    if (dependent[i] || dependent.some((dep, t) => dep && Math.abs(a[i][t]) > SINGULAR)) return Infinity;
    return -row[i];
  });
}
