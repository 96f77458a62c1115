// How far an orbit's end still is from the periodic state, and the step that closes most of it.
// Over one orbit of period P the network's slow part behaves like the linear system C dT/dt = -K dT
// with K the conductance matrix linearised at the orbit's mean temperatures (slow modes see the
// orbit-averaged network). Mode by mode, with x = P lambda (lambda = 1/tau an eigenvalue of
// C^-1 K), a drift F over the orbit leaves the distance F / (e^x - 1) from the orbit's end to the
// periodic state: about F tau / P for a slow node, next to nothing for a fast one. So a change of
// 0.01 K over an orbit is 10 K still to go for a node with tau = 1000 P.
// We evaluate 1/(e^x - 1) = 1/x - 1/2 + x/12 - ... with the rational form 1/x - (1/2)/(1 + x/6),
// right to second order at small x (the slow modes, where it matters), as two sparse solves:
//   distance = K^-1 (C F) / P  -  (1/2) (C + P K / 6)^-1 (C F).
// The first term is the orbit's net energy balance (C F / P, the mean heat each node gained) spread
// over the network's conductances: the temperature shift that would lose that heat. From x = 3 on
// the form is no estimate of the distance (zero at x = 3, then slightly negative, tending to 0),
// but there the orbit itself has closed all but e^-x of the gap: taking the step leaves
// e^-x - f(x) (1 - e^-x) of the error, under 0.09 of it for every x (largest near x = 10), so it
// shrinks a linear network's distance about tenfold per orbit where repetition alone shrinks a
// slow mode only by e^-x (thermal-orbit-correction.spec.ts checks both).
// Controllers: a thermostat cycling within the orbit works like a conductance of its power over its
// band (the duty moves across the band as the load moves); a PI heater like its proportional gain;
// a loop like its present flow's conductance. Both solves are on the network's own sparse pattern.
import type { SparseCholesky } from './sparse-cholesky';
import type { ThermalControllers } from './thermal-controllers';
import { assembleNetworkMatrix, type ThermalNetwork } from './thermal-network';

/** Caps tau at 1e9 orbits so a node with no conductance at all still factors (its drift is then 0 or it runs away). */
const SHIFT_ORBITS = 1e9;
/**
 * A thermostat that cycles holds its node's orbit mean inside its band whatever the load, as long as
 * its duty has room: to the slow modes the node is pinned. Its power over its band, times this, is
 * stiff enough to pin it (tried on the bench model: 1x gave 6 orbits, 100x and up 5).
 */
const PIN_GAIN = 1e3;

export class OrbitCorrection {
  private readonly conductance: SparseCholesky;
  private readonly blended: SparseCholesky;
  private readonly diag: Float64Array;
  private readonly lower: Float64Array;
  private readonly extraWK: Float64Array;
  private readonly heat: Float64Array;
  private readonly work: Float64Array;

  constructor(private readonly net: ThermalNetwork) {
    this.conductance = net.factor.samePattern();
    this.blended = net.factor.samePattern();
    this.diag = new Float64Array(net.n);
    this.lower = new Float64Array(net.factor.nonZeros);
    this.extraWK = new Float64Array(net.n);
    this.heat = new Float64Array(net.n);
    this.work = new Float64Array(net.n);
  }

  /**
   * Writes into `out` the estimated distance from the end of the span to the periodic state, K, given
   * each node's mean temperature over the span, its drift over it (end minus start) and the span, s.
   * `heaterOnS` is each heater's time on during the span. Answers the largest distance of any node,
   * or NaN when the network's matrix cannot be factored (then `out` is zero).
   */
  distance(meanK: Float64Array, driftK: Float64Array, spanS: number, controllers: ThermalControllers, heaterOnS: Float64Array, out: Float64Array): number {
    const { net, diag, lower, extraWK, heat, work } = this;
    const n = net.n;
    out.fill(0);
    extraWK.set(controllers.extraWK);
    // extraWK holds the loops' conductances as the last step left them; heaters add their gains.
    controllers.heaters.forEach((h, k) => {
      if (!h.thermostat) extraWK[h.free] += h.kp;
      else if (heaterOnS[k] > 0 && heaterOnS[k] < spanS) extraWK[h.free] += (PIN_GAIN * h.powerW) / Math.max(h.offK - h.onK, 1e-3);
    });
    assembleNetworkMatrix(net, meanK, 1 / (SHIFT_ORBITS * spanS), extraWK, diag, lower);
    if (!this.conductance.factor(diag, lower)) return NaN;
    assembleNetworkMatrix(net, meanK, 6 / spanS, extraWK, diag, lower);
    if (!this.blended.factor(diag, lower)) return NaN;
    for (let i = 0; i < n; i++) {
      heat[i] = net.capacitanceJK[i] * driftK[i];
      out[i] = heat[i] / spanS;
      // (C + P K / 6)^-1 C F = 6/P (6 C / P + K)^-1 C F: the blended factor holds 6 C / P + K.
      work[i] = (6 * heat[i]) / spanS;
    }
    this.conductance.solve(out);
    this.blended.solve(work);
    let largest = 0;
    for (let i = 0; i < n; i++) {
      out[i] -= 0.5 * work[i];
      const a = Math.abs(out[i]);
      if (!Number.isFinite(a)) {
        out.fill(0);
        return NaN;
      }
      if (a > largest) largest = a;
    }
    return largest;
  }
}
