// How numbers and times read on plot axes, read-outs and tables.
import { format } from 'd3';
import { utcText } from '../time/utc-time';
import type { XKind } from './plot-series';

const largeFormat = format(',.0f');
const significantFormat = format('.3~r');

/** A read-out value: whole numbers from 100 up, three significant figures below. */
export function formatValue(value: number): string {
  if (!Number.isFinite(value)) return '–';
  return Math.abs(value) >= 100 ? largeFormat(value) : significantFormat(value);
}

/** A value with its unit, e.g. "1,361 W/m²"; a space before every unit, "20 °C" included (SI style). */
export function formatWithUnit(value: number, unit: string): string {
  return unit ? `${formatValue(value)} ${unit}` : formatValue(value);
}

/** An x position: a date in UTC (analysts compare against propagator output, which is UTC) or a number. */
export function formatX(x: number, kind: XKind, unit: string): string {
  return kind === 'date' ? utcText(x, 'minute') : formatWithUnit(x, unit);
}

/** An axis title with its unit in parentheses: "Time (min)". */
export function axisTitle(label: string, unit: string): string {
  return unit ? `${label} (${unit})` : label;
}
