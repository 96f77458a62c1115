// Closed forms the thermal specs check the solver against (no solver code uses these).

/**
 * Periodic solution of C dT/dt = Q - G T (T above its sink) with Q on for the first onS of each
 * period: a rise toward Q/G while on, a decay toward 0 while off (lumped capacitance, tau = C/G,
 * Incropera, Fundamentals of Heat and Mass Transfer, ch. 5). Answers T(t) for t within the period,
 * and the cycle's low and high.
 */
export function periodicFirstOrderLag(q: number, G: number, C: number, onS: number, periodS: number) {
  const tau = C / G;
  const tInf = q / G;
  const a = Math.exp(-onS / tau);
  const b = Math.exp(-(periodS - onS) / tau);
  const low = (tInf * (1 - a) * b) / (1 - a * b);
  const high = tInf + (low - tInf) * a;
  const at = (t: number) => (t <= onS ? tInf + (low - tInf) * Math.exp(-t / tau) : high * Math.exp(-(t - onS) / tau));
  return { at, low, high };
}
