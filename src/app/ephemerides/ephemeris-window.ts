// The time window a user picks on an ephemeris, typed as ISO 8601 in 24-hour UTC ("2027-03-20
// 12:00:00"; a plain text field, since the browser's date-time field writes the locale's 12-hour
// clock), and the ISO 8601 epochs the API takes.

/** "2027-03-20T12:00:00.000Z" as the field shows it: "2027-03-20 12:00:00". */
export function utcFieldValue(iso: string): string {
  const ms = Date.parse(iso);
  return Number.isNaN(ms) ? '' : new Date(ms).toISOString().slice(0, 19).replace('T', ' ');
}

/**
 * The field's text ("2027-03-20 12:00", with seconds, a "T" for the space, a closing "Z" or "UTC")
 * as an ISO 8601 UTC epoch; null when it is not one.
 */
export function isoFromUtcField(text: string): string | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:\.(\d{1,3}))?)?\s*(?:Z|UTC)?$/i.exec(text.trim().replace(/\s+/g, ' '));
  if (!match) return null;
  const [year, month, day, hour, minute, second = '0', fraction = '0'] = match.slice(1);
  const ms = Date.UTC(+year!, +month! - 1, +day!, +hour!, +minute!, +second, Number(fraction.padEnd(3, '0')));
  const date = new Date(ms);
  // Date.UTC rolls 2027-02-30 over to March: such a day is not a date
  if (date.getUTCDate() !== +day! || date.getUTCMonth() !== +month! - 1 || +hour! > 23 || +minute! > 59 || +second > 59) return null;
  return date.toISOString();
}

/** "12:00:00 – 13:35:40 UTC on 2027-03-20", or both dates when the window crosses midnight. */
export function windowText(from: string, to: string): string {
  const [a, b] = [new Date(from).toISOString(), new Date(to).toISOString()];
  const [dayA, dayB] = [a.slice(0, 10), b.slice(0, 10)];
  return dayA === dayB ? `${a.slice(11, 19)} – ${b.slice(11, 19)} UTC on ${dayA}` : `${dayA} ${a.slice(11, 19)} – ${dayB} ${b.slice(11, 19)} UTC`;
}
