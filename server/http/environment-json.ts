// The compute route's default answer written as JSON bytes straight from the columns: the same
// bytes as JSON.stringify(environmentResult(c)) in UTF-8 (tests hold them equal), without first
// building the 3600 x 20 = 72,000 per-sample objects that JSON.stringify would then walk again, and
// without the 8 MB string (the samples are written a piece of 200 at a time, each piece sent while
// the next is written). Every number is written as JSON.stringify writes it (the shortest text that
// reads back to the same double; null for NaN and the infinities): the API promises no rounding,
// and the columnar and Arrow forms carry the very same doubles. Turning numbers into text is most of
// the work, so
// - a value equal to its column's value at the step before is copied from that step's text, not
//   formatted again (two thirds of the P1 orbit's 288,000 loads: faces in shadow, a constant planet IR);
// - the others are formatted all at once per piece, by one JSON.stringify of a plain array of
//   numbers (V8's fast path: about half the cost of a string per number), and the piece's bytes
//   are copied together from that text and the step's fixed text (keys, names) in one pass;
// CPU time per P1 answer on this machine (medians, bench off): about 40 ms, against 44 ms for a
// string per value with the repeats cached, 55 ms for a string per value and a Buffer write per
// surface entry (before), and 59 ms for building the objects and JSON.stringify of them.
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
  // Each step is the same text around its numbers: literal[i] goes before value i (its columns[i]
  // at the step), `closing` after the last. Names are written once here, escaped by JSON.stringify.
  const literals = ['{"tS":', ',"trueAnomalyDeg":', ',"sunlit":'];
  const columns: ArrayLike<number>[] = [tS, trueAnomalyRad.map((v) => v / DEG), sunlit];
  let next = ',"surfaces":[';
  names.forEach((name, j) => {
    literals.push(`${next}${j === 0 ? '' : ','}{"name":${JSON.stringify(name)},"solarWm2":`, ',"albedoWm2":', ',"irWm2":', ',"absorbedW":');
    columns.push(solarWm2[j], albedoWm2[j], irWm2[j], absorbedW[j]);
    next = '}';
  });
  next += ']';
  if (parentSunlit) {
    literals.push(`${next},"parentSunlit":`);
    columns.push(parentSunlit);
    next = '';
  }
  // The literals' bytes one after another (the closing last), literal i from starts[i] to starts[i + 1].
  const text = Buffer.from(literals.join('') + `${next}}`, 'utf8');
  const starts = new Uint32Array(literals.length + 2);
  literals.forEach((l, i) => (starts[i + 1] = starts[i] + Buffer.byteLength(l, 'utf8')));
  starts[literals.length + 1] = text.length;
  const values = columns.length;
  const stepBytes = 1 + text.length + values * NUMBER_BYTES;
  function* pieces(): Generator<Uint8Array> {
    // Each value's text at the step before: a value equal to its column's step before (a face in
    // shadow, a constant planet IR: two thirds of the P1 orbit's values) is copied, not formatted.
    // NaN never equals itself, so the first step (and a NaN) is always formatted.
    const last = new Float64Array(values).fill(NaN);
    const lastText = new Uint8Array(values * NUMBER_BYTES);
    const lastLength = new Uint8Array(values);
    const formatted = new Uint8Array(PIECE_STEPS * values);
    const fresh: number[] = [];
    yield Buffer.from(head, 'utf8');
    for (let from = 0; from < steps; from += PIECE_STEPS) {
      const to = Math.min(steps, from + PIECE_STEPS);
      // The values not seen at the step before, in the order they are written, all turned into
      // text by one JSON.stringify of a plain array of numbers (V8's fast path, null for NaN and
      // the infinities as JSON.stringify of the answer writes them).
      fresh.length = 0;
      for (let k = from, f = 0; k < to; k++) {
        for (let i = 0; i < values; i++, f++) {
          const v = columns[i][k];
          formatted[f] = v !== last[i] ? 1 : 0;
          if (formatted[f] === 1) {
            last[i] = v;
            fresh.push(v);
          }
        }
      }
      const digits = Buffer.from(JSON.stringify(fresh), 'latin1');
      let d = 1;
      const out = Buffer.allocUnsafe((to - from) * stepBytes);
      let p = 0;
      for (let k = from, f = 0; k < to; k++) {
        if (k > 0) out[p++] = 0x2c;
        for (let i = 0; i < values; i++, f++) {
          for (let b = starts[i], end = starts[i + 1]; b < end; b++) out[p++] = text[b];
          const at = i * NUMBER_BYTES;
          if (formatted[f] === 1) {
            let length = 0;
            // Up to the comma or the closing bracket after the number (a number's text has neither).
            for (let c = digits[d]; c !== 0x2c && c !== 0x5d; c = digits[++d]) {
              out[p++] = c;
              lastText[at + length++] = c;
            }
            d++;
            lastLength[i] = length;
          } else {
            for (let b = 0, length = lastLength[i]; b < length; b++) out[p++] = lastText[at + b];
          }
        }
        for (let b = starts[values], end = starts[values + 1]; b < end; b++) out[p++] = text[b];
      }
      yield out.subarray(0, p);
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
