// Epochs as ephemeris files write them: ISO 8601 calendar dates (2027-03-20T12:00:00.123Z) and the
// day-of-year form CCSDS files also use (2027-079T12:00:00.123). Parsed by hand because Date.parse
// drops digits below a millisecond and accepts forms (local time, "March 20") that must be refused.
// No zone means UTC (an OEM's TIME_SYSTEM says so; a CSV's header says "ISO 8601 UTC").

const calendar = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2}):(\d{2}(?:\.\d+)?)(Z|[+-]\d{2}:?\d{2})?$/i;
const ordinal = /^(\d{4})-(\d{3})T(\d{2}):(\d{2}):(\d{2}(?:\.\d+)?)Z?$/i;

function offsetMinutes(zone: string | undefined): number {
  if (!zone || zone.toUpperCase() === 'Z') return 0;
  const sign = zone.startsWith('-') ? -1 : 1;
  const digits = zone.slice(1).replace(':', '');
  return sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2)));
}

const digit = (text: string, at: number): number => {
  const d = text.charCodeAt(at) - 48;
  return d >= 0 && d <= 9 ? d : -1;
};
const twoDigits = (text: string, at: number): number => {
  const [a, b] = [digit(text, at), digit(text, at + 1)];
  return a < 0 || b < 0 ? -1 : 10 * a + b;
};
// The last day read: an ephemeris has thousands of rows a day, so its midnight is worked out once.
let cachedDayKey = -1;
let cachedMidnight = 0;

/**
 * The form nearly every file writes, 2027-03-20T12:00:00(.fff)Z, read by character codes with the
 * same checks as the calendar pattern; undefined for any other form (the patterns then decide).
 */
function parseZuluCalendar(text: string): number | null | undefined {
  const n = text.length;
  if (n < 20 || text.charCodeAt(4) !== 45 || text.charCodeAt(7) !== 45 || text.charCodeAt(13) !== 58 || text.charCodeAt(16) !== 58) return undefined;
  const separator = text.charCodeAt(10);
  const zone = text.charCodeAt(n - 1);
  if ((separator !== 84 && separator !== 116 && separator !== 32) || (zone !== 90 && zone !== 122)) return undefined;
  const [y1, y2] = [twoDigits(text, 0), twoDigits(text, 2)];
  const [month, day, hour, minute, whole] = [twoDigits(text, 5), twoDigits(text, 8), twoDigits(text, 11), twoDigits(text, 14), twoDigits(text, 17)];
  if (y1 < 0 || y2 < 0 || month < 0 || day < 0 || hour < 0 || minute < 0 || whole < 0) return undefined;
  let seconds = whole;
  if (n > 20) {
    // a fraction: a point and at least one digit before the Z
    if (text.charCodeAt(19) !== 46 || n === 21) return undefined;
    let scaled = whole;
    for (let k = 20; k < n - 1; k++) {
      const d = digit(text, k);
      if (d < 0) return undefined;
      scaled = scaled * 10 + d;
    }
    const places = n - 21;
    // Up to 13 places the digits make an exact integer and 10^places is exact, so the one division
    // rounds as Number() would round the text; longer fractions go through Number().
    seconds = places <= 13 ? scaled / 10 ** places : Number(text.slice(17, n - 1));
  }
  if (month < 1 || month > 12 || day < 1 || hour > 23 || minute > 59 || seconds >= 61) return null;
  const year = 100 * y1 + y2;
  const key = (year * 100 + month) * 100 + day;
  if (key !== cachedDayKey) {
    const midnight = Date.UTC(year, month - 1, day);
    // Date.UTC rolls 31 February over into March; a real date keeps its day.
    if (new Date(midnight).getUTCDate() !== day) return null;
    cachedDayKey = key;
    cachedMidnight = midnight;
  }
  return cachedMidnight + ((hour * 60 + minute) * 60 + seconds) * 1000;
}

/** ms since the Unix epoch (fractions kept), or null when the text is not such an epoch. */
export function parseEpochMs(text: string): number | null {
  const fast = parseZuluCalendar(text);
  if (fast !== undefined) return fast;
  const c = calendar.exec(text);
  if (c) {
    const [year, month, day, hour, minute] = [c[1], c[2], c[3], c[4], c[5]].map(Number);
    const seconds = Number(c[6]);
    if (month < 1 || month > 12 || day < 1 || hour > 23 || minute > 59 || seconds >= 61) return null;
    const midnight = Date.UTC(year, month - 1, day);
    // Date.UTC rolls 31 February over into March; a real date keeps its day.
    if (new Date(midnight).getUTCDate() !== day) return null;
    return midnight + ((hour * 60 + minute - offsetMinutes(c[7])) * 60 + seconds) * 1000;
  }
  const o = ordinal.exec(text);
  if (o) {
    const [year, dayOfYear, hour, minute] = [o[1], o[2], o[3], o[4]].map(Number);
    const seconds = Number(o[5]);
    const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
    if (dayOfYear < 1 || dayOfYear > (leap ? 366 : 365) || hour > 23 || minute > 59 || seconds >= 61) return null;
    return Date.UTC(year, 0, dayOfYear) + ((hour * 60 + minute) * 60 + seconds) * 1000;
  }
  return null;
}

/** ISO 8601 UTC text of an epoch, to the millisecond. */
export const epochText = (tMs: number): string => new Date(Math.round(tMs)).toISOString();
