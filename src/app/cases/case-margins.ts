import {
  CORRELATED_TEMPERATURE_MARGIN_C,
  DEFAULT_HEAT_LOAD_MARGIN_PERCENT,
  DEFAULT_TEMPERATURE_MARGIN_C,
} from '../../../shared/physics/design-environment';

// The margin defaults are the physics module's (DOMAIN.md "Margins"), shown as defaults with where
// they come from, so a changed value reads as the project's choice rather than a new standard.
export const MARGIN_DEFAULTS = {
  heatLoadPercent: DEFAULT_HEAT_LOAD_MARGIN_PERCENT,
  temperatureMarginC: DEFAULT_TEMPERATURE_MARGIN_C,
} as const;

export function heatLoadMarginHint(value: number | null): string {
  return value === DEFAULT_HEAT_LOAD_MARGIN_PERCENT
    ? `${DEFAULT_HEAT_LOAD_MARGIN_PERCENT} % (default, MIL-STD-1540 via Gilmore Ch. 19)`
    : `Project choice; the default is ${DEFAULT_HEAT_LOAD_MARGIN_PERCENT} % (MIL-STD-1540 via Gilmore Ch. 19)`;
}

export function temperatureMarginHint(value: number | null): string {
  if (value === DEFAULT_TEMPERATURE_MARGIN_C) {
    return `${DEFAULT_TEMPERATURE_MARGIN_C} K (default before model correlation, MIL-STD-1540 via Gilmore Ch. 19)`;
  }
  if (value === CORRELATED_TEMPERATURE_MARGIN_C) {
    return `${CORRELATED_TEMPERATURE_MARGIN_C} K (MIL-STD-1540 with a correlated model, via Gilmore Ch. 19)`;
  }
  return `Project choice; the default is ${DEFAULT_TEMPERATURE_MARGIN_C} K (${CORRELATED_TEMPERATURE_MARGIN_C} K once correlated)`;
}
