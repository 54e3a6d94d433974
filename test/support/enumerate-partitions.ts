/**
 * Every partition of n, each as its parts largest first, by the classical lexicographic walk
 * (largest part first, then the rest into parts no larger). Test-only: used as the cell list of
 * chi-square tests, so the count must equal p(n) (OEIS A000041), which the callers check.
 */
export function enumeratePartitions(n: number): number[][] {
  const out: number[][] = [];
  const walk = (rest: number, maxPart: number, prefix: number[]): void => {
    if (rest === 0) {
      out.push(prefix.slice());
      return;
    }
    for (let part = Math.min(rest, maxPart); part >= 1; part--) {
      prefix.push(part);
      walk(rest - part, part, prefix);
      prefix.pop();
    }
  };
  walk(n, n, []);
  return out;
}

/** A key for a list of parts (largest first), e.g. "5,4,2,1". */
export function partsKey(parts: readonly number[]): string {
  return parts.join(',');
}
