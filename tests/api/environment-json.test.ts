// The compute route's default JSON written straight from the columns (server/http/environment-json.ts)
// is JSON.stringify's text of the answer object, byte for byte, also where the writer reuses the text
// of a value (or a whole surface entry) equal to the step before's: runs of one value, a value
// changing in only one of a surface's four quantities, 0 after -0 and back (both "0"), NaN and the
// infinities (null) alone and in runs, a planet's shadow column, ASCII and non-ASCII names (common
// practice, no source: the reference is JSON.stringify itself).
import { describe, expect, it } from 'vitest';
import { asEnvironmentRequest, environmentRequest } from '../../shared/api/environment';
import { computeEnvironmentColumns, environmentResult } from '../../shared/physics/environment';
import { environmentJson, environmentJsonPieces } from '../../server/http/environment-json';

const surfaces = [
  { name: 'nadir panel', normal: 'nadir', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 },
  { name: 'zenith radiator', normal: 'zenith', areaM2: 0.4, absorptivity: 0.2, emissivity: 0.9 },
];

function columnsFor(names: string[], steps: number) {
  const request = environmentRequest.parse({
    bodyId: 'earth', orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6 }, epoch: '2027-03-20T12:00:00Z', steps,
    surfaces: names.map((name, j) => ({ ...surfaces[j % surfaces.length], name })),
  });
  return computeEnvironmentColumns(asEnvironmentRequest(request));
}

/** Values that repeat, alternate, are not finite or have the longest texts (24 characters), in the order a column will hold them. */
const awkward = [0, 0, -0, 0, -0, NaN, NaN, 1.5, 1.5, Infinity, -Infinity, -Infinity, 0.1 + 0.2, 0.30000000000000004, 1e21, 1e-7, 5e-324, -0, NaN, 7, -2.2250738585072014e-308, -Number.MAX_VALUE];

describe('environmentJsonPieces', () => {
  it('writes JSON.stringify\'s bytes where values repeat, change one quantity at a time, or are -0, NaN or infinite', () => {
    for (const names of [['nadir panel', 'zenith radiator', 'wake'], ['Sonnensegel "süd" ☀', 'tilted\\panel']]) {
      const c = columnsFor(names, 480);
      const { solarWm2, albedoWm2, irWm2, absorbedW } = c.loads;
      [solarWm2, albedoWm2, irWm2, absorbedW].forEach((quantity, q) => {
        for (let k = 0; k < 480; k++) {
          // Quantity q of surface 0 takes the awkward values in runs offset by q, so the four change at different steps.
          quantity[0][k] = awkward[Math.floor((k + 3 * q) / 2) % awkward.length];
          // Surface 1 holds one value over long runs (a face in shadow), then NaN and back.
          quantity[1][k] = k < 150 ? 2.25 : k < 160 ? NaN : k < 300 ? -0 : quantity[1][k];
        }
      });
      c.grid.tS[7] = NaN;
      c.shade.sunlit[8] = -0;
      const withShadow = { ...c, parentSunlit: Float64Array.from({ length: 480 }, (_, k) => (k % 7 === 0 ? NaN : k % 3 === 0 ? 1 : 0.5)) };
      for (const columns of [c, withShadow]) {
        expect(environmentJson(columns).toString('utf8')).toBe(JSON.stringify(environmentResult(columns)));
      }
    }
  });

  it('writes the samples in several pieces whose bytes join into the whole answer, within the size it announces', () => {
    const c = columnsFor(['nadir panel', 'zenith radiator'], 1000);
    const { pieces, byteLength } = environmentJsonPieces(c);
    const all = [...pieces];
    expect(all.length).toBeGreaterThan(3);
    const joined = Buffer.concat(all);
    expect(joined.equals(Buffer.from(JSON.stringify(environmentResult(c))))).toBe(true);
    expect(joined.length).toBeLessThanOrEqual(byteLength);
  });
});
