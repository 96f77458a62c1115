// The loops' controllers in the periodic-state search (thermal-periodic.ts): their PI integrals are
// part of the state that must repeat, so the orbit map that search extrapolates carries them too.
import type { ThermalControllers } from './thermal-controllers';

/**
 * The loops' PI integrals as extra components of the orbit map that the periodic search
 * extrapolates: each scaled by 1/kp (a flow change in the kelvin its proportional term would ask
 * for) so that its residual weighs like a temperature's. Without them a slow integral winds for
 * dozens of orbits while the temperatures it drives are jumped ahead.
 */
export class LoopIntegrals {
  private readonly loops: number[];
  private readonly scale: number[];

  constructor(private readonly controllers: ThermalControllers) {
    this.loops = controllers.loops.map((l, k) => (l.control >= 0 && l.ki > 0 ? k : -1)).filter((k) => k >= 0);
    this.scale = this.loops.map((k) => {
      const l = controllers.loops[k];
      return l.kp > 0 ? 1 / l.kp : 1 / Math.max(l.maxFlow - l.minFlow, 1e-12);
    });
  }

  get size(): number {
    return this.loops.length;
  }

  /** Writes the scaled integrals into `out` from `offset`. */
  read(out: Float64Array, offset: number): void {
    this.loops.forEach((k, j) => (out[offset + j] = this.controllers.loopIntegral[k] * this.scale[j]));
  }

  /** Sets the integrals from scaled values at `offset`, kept within their flow range. */
  write(from: Float64Array, offset: number): void {
    this.loops.forEach((k, j) => {
      const l = this.controllers.loops[k];
      this.controllers.loopIntegral[k] = Math.min(Math.max(from[offset + j] / this.scale[j], l.minFlow - l.nominalFlow), l.maxFlow - l.nominalFlow);
    });
  }
}
