// How results are rounded where they are stored or answered: to `digits` decimals, half up
// (Math.round), and never -0, so a value that rounds to nothing reads 0 in JSON, CSV and on screen.

/** `x` to `digits` decimals (4 unless said), never -0. */
export const round = (x: number, digits = 4): number => {
  const k = 10 ** digits;
  const r = Math.round(x * k) / k;
  return Object.is(r, -0) ? 0 : r;
};
