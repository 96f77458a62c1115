// A brute-force reference for the specs: the flux on a plate from a sphere whose exitance varies
// with the Sun's zenith angle, by the midpoint rule over the ground cap the plate's point sees.
// Slow on purpose and independent of cap-radiance.ts's nodes (it integrates over the ground, not
// over the spacecraft's view), so the two can check each other. Used by tests only.
// Source: the differential view-factor integral, F = (1/pi) * integral of cos(t1) cos(t2) / d^2 dA
// (Howell catalogue introduction).

/**
 * (1/pi) * integral over the visible cap of M(mu) cos(t1) cos(t2) / d^2 dA: sphere radius 1, the
 * plate at h on +z with unit normal n, the Sun's unit direction s; mu = cos of the Sun's zenith
 * angle on the ground. With M = 1 this is the plate-to-sphere view factor.
 */
export function bruteForceCapFlux(h: number, n: readonly number[], s: readonly number[], exitance: (mu: number) => number, nPsi = 300, nPhi = 600): number {
  const psiMax = Math.acos(1 / h);
  const [dPsi, dPhi] = [psiMax / nPsi, (2 * Math.PI) / nPhi];
  let sum = 0;
  for (let i = 0; i < nPsi; i++) {
    const psi = (i + 0.5) * dPsi;
    const [sp, cp] = [Math.sin(psi), Math.cos(psi)];
    for (let j = 0; j < nPhi; j++) {
      const phi = (j + 0.5) * dPhi;
      const p = [sp * Math.cos(phi), sp * Math.sin(phi), cp];
      const d = [p[0], p[1], p[2] - h];
      const d2 = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
      const length = Math.sqrt(d2);
      const cosPlate = (n[0] * d[0] + n[1] * d[1] + n[2] * d[2]) / length;
      const cosGround = -(p[0] * d[0] + p[1] * d[1] + p[2] * d[2]) / length;
      if (cosPlate > 0 && cosGround > 0) sum += (exitance(p[0] * s[0] + p[1] * s[1] + p[2] * s[2]) * cosPlate * cosGround * sp) / d2;
    }
  }
  return (sum * dPsi * dPhi) / Math.PI;
}
