/**
 * The limiting distribution of √n·D (Kolmogorov's distribution): its upper tail
 * Q(λ) = 2 Σ_{k≥1} (−1)^(k−1) exp(−2k²λ²).
 *
 * Source: Kolmogorov, A. (1933). Sulla determinazione empirica di una legge di distribuzione.
 * *Giornale dell'Istituto Italiano degli Attuari*, 4, 83–91; for two samples Smirnov, N. (1948).
 * Table for estimating the goodness of fit of empirical distributions. *Annals of Mathematical
 * Statistics*, 19(2), 279–281. The series converges fast for λ above about 0.3; below it Q is 1 to
 * double precision (the terms alternate and would cancel badly), so 1 is returned there.
 *
 * @param lambda √(effective n) · D, at least 0
 * @returns P(√n·D > λ) in the limit
 * @example
 * kolmogorovSurvival(1.3581); // => 0.05 (about)
 */
export function kolmogorovSurvival(lambda: number): number {
  if (!(lambda > 0.2)) return 1;
  let sum = 0;
  for (let k = 1; k <= 100; k++) {
    const term = Math.exp(-2 * k * k * lambda * lambda);
    sum += k % 2 === 1 ? term : -term;
    if (term < 1e-17) break;
  }
  return Math.min(1, Math.max(0, 2 * sum));
}
