// The one place the client writes a moment in time: ISO 8601 dates and a 24-hour clock, always in
// UTC (analysts compare against propagator output and each other across time zones), never the
// browser's locale. Tables, read-outs, plot axes and the time-window fields all come through here.
import { utcDay, utcFormat, utcHour, utcMinute, utcMonth, utcSecond, utcYear } from 'd3';

/** How much of the moment to write: "2027-06-01", "2027-06-01 12:30 UTC", "2027-06-01 12:30:05 UTC". */
export type UtcPrecision = 'date' | 'minute' | 'second';

const FORMATS: Readonly<Record<UtcPrecision, (date: Date) => string>> = {
  date: utcFormat('%Y-%m-%d'),
  minute: utcFormat('%Y-%m-%d %H:%M UTC'),
  second: utcFormat('%Y-%m-%d %H:%M:%S UTC'),
};

function asDate(value: string | number | Date | null | undefined): Date | null {
  if (value === null || value === undefined || value === '') return null;
  const date = value instanceof Date ? value : new Date(value);
  return Number.isFinite(date.getTime()) ? date : null;
}

/** A moment as ISO 8601 in UTC with a 24-hour clock; '' for no moment or one that is not a date. */
export function utcText(value: string | number | Date | null | undefined, precision: UtcPrecision = 'minute'): string {
  const date = asDate(value);
  return date === null ? '' : FORMATS[precision](date);
}

const tickMillisecond = utcFormat('%H:%M:%S.%L');
const tickSecond = utcFormat('%H:%M:%S');
const tickMinute = utcFormat('%H:%M');
const tickDay = utcFormat('%Y-%m-%d');
const tickMonth = utcFormat('%Y-%m');
const tickYear = utcFormat('%Y');

/**
 * A time axis tick in 24-hour UTC: the clock within a day ("06:00", "12:30:15"), the ISO date at
 * midnight ("2027-06-02"), then "2027-07" and "2027" for coarser steps. Replaces d3's default,
 * which writes a 12-hour clock ("01 AM") and month names.
 */
export function utcTickLabel(date: Date): string {
  if (utcSecond(date) < date) return tickMillisecond(date);
  if (utcMinute(date) < date) return tickSecond(date);
  if (utcHour(date) < date || utcDay(date) < date) return tickMinute(date);
  if (utcMonth(date) < date) return tickDay(date);
  if (utcYear(date) < date) return tickMonth(date);
  return tickYear(date);
}

/** Whether text is a calendar day written the ISO 8601 way, "2027-06-01" (2027-02-30 is not one). */
export function isIsoDate(text: string): boolean {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text.trim());
  if (!match) return false;
  const date = new Date(Date.UTC(+match[1]!, +match[2]! - 1, +match[3]!));
  return date.getUTCMonth() === +match[2]! - 1 && date.getUTCDate() === +match[3]!;
}
