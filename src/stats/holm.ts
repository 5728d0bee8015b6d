/**
 * Holm's step-down adjusted p-values (Holm 1979, Scand. J. Statist. 6:65–70).
 *
 * With the m finite p-values sorted ascending, p_(1) ≤ … ≤ p_(m), the adjusted value is
 * p̃_(i) = max_{j ≤ i} min(1, (m − j + 1) · p_(j)); rejecting where p̃ < α is Holm's
 * procedure at family-wise level α. NaN entries are passed through as NaN and do not
 * count towards m. The output is in the input order.
 */
export function holm(pValues: readonly number[]): number[] {
  for (const p of pValues) {
    if (!Number.isNaN(p) && !(p >= 0 && p <= 1)) throw new Error(`holm: p-values must lie in [0, 1] or be NaN, got ${p}`);
  }
  const order = pValues.map((p, i) => ({ p, i })).filter((e) => !Number.isNaN(e.p)).sort((x, y) => x.p - y.p);
  const m = order.length;
  const adjusted = pValues.map(() => NaN);
  let running = 0;
  order.forEach(({ p, i }, rank) => {
    running = Math.max(running, Math.min(1, (m - rank) * p));
    adjusted[i] = running;
  });
  return adjusted;
}
