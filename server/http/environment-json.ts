// The compute route's default answer written as JSON bytes straight from the columns: the same
// bytes as JSON.stringify(environmentResult(c)) in UTF-8 (tests hold them equal), without first
// building the 3600 x 20 = 72,000 per-sample objects that JSON.stringify would then walk again, and
// without the 8 MB string (the samples are written a piece of 200 at a time, each piece sent while
// the next is written). Most of the time goes to turning numbers into text (every value as
// JavaScript prints it, the shortest text that reads back to the same double, as JSON.stringify
// does); a value equal to its column's value at the step before is not turned into text again (two
// thirds of the P1 orbit's 288,000 loads: faces in shadow, a constant planet IR), and a surface
// entry whose four values are all unchanged is reused whole. Each piece is gathered as one string
// and written to its Buffer in one call (a call per surface entry cost about as much as the text).
import { Buffer } from 'node:buffer';
import { environmentAssumptions, environmentHeader, type EnvironmentColumns } from '../../shared/physics/environment';
import { surfaceLoads } from '../../shared/physics/profile-loads';
import { DEG } from '../../shared/physics/vector3';

const PROFILE = '"profile":0';
/** The longest text of a double: "-1.2345678901234567e-308". */
const NUMBER_BYTES = 24;

/** Samples written into one piece (about 0.5 MB of text at 20 surfaces). */
const PIECE_STEPS = 200;

/**
 * The default JSON of the answer in pieces of PIECE_STEPS samples, each formatted when asked for,
 * and an upper bound of its length.
 */
export function environmentJsonPieces(c: EnvironmentColumns): { pieces: Iterable<Uint8Array>; byteLength: number } {
  const { names, solarWm2, albedoWm2, irWm2, absorbedW, steps } = c.loads;
  const { tS, trueAnomalyRad } = c.grid;
  const { sunlit } = c.shade;
  const { parentSunlit } = c;
  // Every field but the profile, in the answer's key order, with a marker where the profile goes.
  const shell = JSON.stringify({
    ...environmentHeader(c),
    warnings: c.warnings,
    profile: 0,
    sampleWeightsS: c.weightS ? [...c.weightS] : null,
    orbitAverage: { surfaces: surfaceLoads(names, c.averages) },
    peak: { surfaces: surfaceLoads(names, c.loads.peaks) },
    assumptions: environmentAssumptions(c),
  });
  const at = shell.indexOf(PROFILE);
  const [head, tail] = [`${shell.slice(0, at)}"profile":[`, `]${shell.slice(at + PROFILE.length)}`];
  const opening = names.map((name, j) => `${j === 0 ? '' : ','}{"name":${JSON.stringify(name)},"solarWm2":`);
  const surfaceBytes = opening.reduce((sum, o) => sum + Buffer.byteLength(o) + 4 * NUMBER_BYTES + 40, 0);
  const stepBytes = surfaceBytes + 4 * NUMBER_BYTES + 80;
  // JSON.stringify writes null for NaN and the infinities.
  const n = (v: number): number | string => (Number.isFinite(v) ? v : 'null');
  // Plain ASCII names (nearly always) let every piece go through the faster one-byte write.
  const ascii = opening.every((o) => /^[\x20-\x7e]*$/.test(o));
  function* pieces(): Generator<Uint8Array> {
    // Each surface's four values at the step before and their texts, and its entry's whole text:
    // a value equal to the step before's (a face in shadow, a constant planet IR: two thirds of the
    // values of the P1 orbit) is not formatted again, a whole entry alike not written again.
    // NaN never equals itself, so the first step (and a NaN) is always formatted.
    const before = new Float64Array(4 * names.length).fill(NaN);
    const beforeText: string[] = new Array<string>(4 * names.length).fill('');
    const entry: string[] = new Array<string>(names.length).fill('');
    const text = (i: number, v: number): string => {
      if (v !== before[i]) {
        before[i] = v;
        beforeText[i] = `${n(v)}`;
      }
      return beforeText[i];
    };
    yield Buffer.from(head, 'utf8');
    for (let from = 0; from < steps; from += PIECE_STEPS) {
      const to = Math.min(steps, from + PIECE_STEPS);
      let piece = '';
      for (let k = from; k < to; k++) {
        piece += `${k === 0 ? '' : ','}{"tS":${n(tS[k])},"trueAnomalyDeg":${n(trueAnomalyRad[k] / DEG)},"sunlit":${n(sunlit[k])},"surfaces":[`;
        for (let j = 0; j < names.length; j++) {
          const i = 4 * j;
          const s = solarWm2[j][k];
          const a = albedoWm2[j][k];
          const r = irWm2[j][k];
          const w = absorbedW[j][k];
          if (s !== before[i] || a !== before[i + 1] || r !== before[i + 2] || w !== before[i + 3]) {
            entry[j] = `${opening[j]}${text(i, s)},"albedoWm2":${text(i + 1, a)},"irWm2":${text(i + 2, r)},"absorbedW":${text(i + 3, w)}}`;
          }
          piece += entry[j];
        }
        piece += parentSunlit ? `],"parentSunlit":${n(parentSunlit[k])}}` : ']}';
      }
      yield Buffer.from(piece, ascii ? 'latin1' : 'utf8');
    }
    yield Buffer.from(tail, 'utf8');
  }
  return { pieces: pieces(), byteLength: Buffer.byteLength(head) + Buffer.byteLength(tail) + steps * stepBytes };
}

/** The whole default JSON as one Buffer: the same bytes as JSON.stringify(environmentResult(c)) in UTF-8. */
export function environmentJson(c: EnvironmentColumns): Buffer {
  return Buffer.concat([...environmentJsonPieces(c).pieces]);
}

/** The answer in the columnar layout (API.md "Answer formats"): the profile as one array per quantity, per surface. */
export function environmentColumnsAnswer(c: EnvironmentColumns): Record<string, unknown> {
  const { names, solarWm2, albedoWm2, irWm2, absorbedW } = c.loads;
  return {
    ...environmentHeader(c),
    warnings: c.warnings,
    profile: {
      tS: c.grid.tS,
      trueAnomalyDeg: c.grid.trueAnomalyRad.map((v) => v / DEG),
      sunlit: c.shade.sunlit,
      surfaces: names.map((name, j) => ({ name, solarWm2: solarWm2[j], albedoWm2: albedoWm2[j], irWm2: irWm2[j], absorbedW: absorbedW[j] })),
      ...(c.parentSunlit ? { parentSunlit: c.parentSunlit } : {}),
    },
    sampleWeightsS: c.weightS ? [...c.weightS] : null,
    orbitAverage: { surfaces: surfaceLoads(names, c.averages) },
    peak: { surfaces: surfaceLoads(names, c.loads.peaks) },
    assumptions: environmentAssumptions(c),
  };
}
