/**
 * The real saddle point t > 0 of a circle-method integrand exp φ(t): Newton's method on
 * φ'(t) = 0 from `start`, safeguarded so that one step at most halves or doubles t (a step to
 * t/2 when φ'' <= 0 or the step overshoots below t/2), stopping once a step moves t by at most
 * tolerance·t or after maxSteps steps. `derivatives(t)` returns [φ'(t), φ''(t)].
 */
export function saddleNewton(
  derivatives: (t: number) => [number, number],
  start: number,
  maxSteps: number,
  tolerance: number,
): number {
  let t = start;
  for (let i = 0; i < maxSteps; i++) {
    const [d1, d2] = derivatives(t);
    let next = t - d1 / d2;
    if (!(d2 > 0) || !(next > t / 2)) next = t / 2;
    else if (next > 2 * t) next = 2 * t;
    const done = Math.abs(next - t) <= tolerance * t;
    t = next;
    if (done) break;
  }
  return t;
}
