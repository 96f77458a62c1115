// The environment parameters a design case starts from: the paired albedo and OLR of a body's hot
// and cold sets, the design margins, and the hot/cold property set (BOL or EOL).
// Leaves out: NASA/TM-2001-211221's tables of Earth's paired albedo and OLR by inclination band and
// averaging time (not transcribed: see DOMAIN.md). Until they are, the catalogue's extremes are
// combined into a bounding set (high albedo with high OLR, low with low), which is more severe than
// any true pair and is marked provisional wherever it is used. Users may enter the published pairs.
import type { Body } from './bodies';

export type PropertySet = 'bol' | 'eol';

export interface EnvironmentPair {
  albedo: number;
  olrWm2: number;
  /** Where the pair came from, in words that travel with the case. */
  source: string;
  provisional: boolean;
  /** An airless body's surface temperature field (emissivity, night floor); its Bond albedo is `albedo`. */
  surfaceField?: { emissivity: number; nightFloorK: number } | undefined;
  /**
   * Bond albedos to try on the chosen day (the ends of the body's published range): a higher albedo
   * reflects more and emits less, so which end is hotter depends on the surfaces' alpha and epsilon.
   */
  albedoChoices?: number[] | undefined;
}

export interface DesignPairs {
  hot: EnvironmentPair;
  cold: EnvironmentPair;
}

const BOUNDING =
  'bounding combination of the catalogue extremes (high albedo with high OLR for hot, low with low for cold); ' +
  'NASA/TM-2001-211221 paired values by inclination band and averaging time not yet transcribed; PROVISIONAL';

/** The hot and cold albedo/OLR sets of a body, for an orbit of the given inclination. */
export function designPairs(body: Body, inclinationDeg: number): DesignPairs {
  if (body.airless) return airlessPairs(body);
  const flatAlbedo = body.albedo.min === body.albedo.max;
  const flatOlr = body.olrWm2.min === body.olrWm2.max;
  if (flatAlbedo && flatOlr) {
    const source = `${body.name} nominal albedo and OLR (the catalogue holds no range): ${body.sources['albedo'] ?? ''}; ${body.sources['olrWm2'] ?? ''}`;
    const pair = { albedo: body.albedo.nominal, olrWm2: body.olrWm2.nominal, source, provisional: body.provisional };
    return { hot: pair, cold: { ...pair } };
  }
  const band = `${body.name}, orbit inclination ${inclinationDeg.toFixed(1)} deg (inclination band not applied)`;
  return {
    hot: { albedo: body.albedo.max, olrWm2: body.olrWm2.max, source: `${band}: ${BOUNDING}`, provisional: true },
    cold: { albedo: body.albedo.min, olrWm2: body.olrWm2.min, source: `${band}: ${BOUNDING}`, provisional: true },
  };
}

/**
 * An airless body's hot and cold sets: its surface temperature field with the emissivity and night
 * floor at the hot (high) or cold (low) end of their published ranges, and both ends of the Bond
 * albedo range tried on the chosen day.
 */
function airlessPairs(body: Body): DesignPairs {
  const surface = body.airless!;
  const albedoSource = body.sources['albedo'] ?? '';
  const pair = (end: 'max' | 'min'): EnvironmentPair => ({
    albedo: body.albedo.nominal,
    olrWm2: body.olrWm2.nominal,
    surfaceField: { emissivity: surface.emissivity[end], nightFloorK: surface.nightFloorK[end] },
    albedoChoices: body.albedo.min === body.albedo.max ? undefined : [body.albedo.min, body.albedo.max],
    source: `${body.name} surface temperature field, the ${end === 'max' ? 'hot' : 'cold'} end of each published range: ` +
      `emissivity ${surface.emissivity[end]} (${surface.sources.emissivity}); night floor ${surface.nightFloorK[end]} K (${surface.sources.nightFloorK}); ` +
      `Bond albedo ${body.albedo.min}..${body.albedo.max} (${albedoSource})`,
    provisional: false,
  });
  return { hot: pair('max'), cold: pair('min') };
}

export interface Margins {
  /** Added to the absorbed loads of a hot case, taken from those of a cold case, in percent. */
  heatLoadPercent: number;
  /** Temperature margin the thermal model's predictions carry, in degrees C (K). */
  temperatureMarginC: number;
  sources: { heatLoadPercent: string; temperatureMarginC: string };
}

// MIL-STD-1540 as summarised in Gilmore, Spacecraft Thermal Control Handbook Vol. I, ch. 19:
// 25 % on heat loads for active systems; 11 C with a correlated model, 17 C before correlation.
export const DEFAULT_HEAT_LOAD_MARGIN_PERCENT = 25;
export const DEFAULT_TEMPERATURE_MARGIN_C = 17;
export const CORRELATED_TEMPERATURE_MARGIN_C = 11;

export const defaultMargins = (): Margins => ({
  heatLoadPercent: DEFAULT_HEAT_LOAD_MARGIN_PERCENT,
  temperatureMarginC: DEFAULT_TEMPERATURE_MARGIN_C,
  sources: {
    heatLoadPercent: `default: MIL-STD-1540, ${DEFAULT_HEAT_LOAD_MARGIN_PERCENT} % on heat loads for active systems (Gilmore Vol. I ch. 19)`,
    temperatureMarginC:
      `default: MIL-STD-1540, ${DEFAULT_TEMPERATURE_MARGIN_C} K before model correlation (${CORRELATED_TEMPERATURE_MARGIN_C} K once correlated) (Gilmore Vol. I ch. 19)`,
  },
});

/** Hot cases add the heat-load margin to the absorbed loads, cold cases take it off. */
export type MarginDirection = 'increase' | 'decrease';

/** The factor on a case's absorbed loads: 1 + margin for a hot case, 1 - margin for a cold one (MIL-STD-1540 via Gilmore Vol. I ch. 19). */
export const heatLoadFactor = (heatLoadPercent: number, direction: MarginDirection): number =>
  direction === 'increase' ? 1 + heatLoadPercent / 100 : 1 - heatLoadPercent / 100;

/** Margins with the user's values over the defaults; a changed value says it was chosen by the project. */
export function resolveMargins(given: { heatLoadPercent?: number | undefined; temperatureMarginC?: number | undefined } | undefined): Margins {
  const margins = defaultMargins();
  if (given?.heatLoadPercent !== undefined && given.heatLoadPercent !== margins.heatLoadPercent) {
    margins.heatLoadPercent = given.heatLoadPercent;
    margins.sources.heatLoadPercent = `project choice (default ${DEFAULT_HEAT_LOAD_MARGIN_PERCENT} % per MIL-STD-1540)`;
  }
  if (given?.temperatureMarginC !== undefined && given.temperatureMarginC !== margins.temperatureMarginC) {
    margins.temperatureMarginC = given.temperatureMarginC;
    margins.sources.temperatureMarginC =
      given.temperatureMarginC === CORRELATED_TEMPERATURE_MARGIN_C
        ? `MIL-STD-1540, ${CORRELATED_TEMPERATURE_MARGIN_C} K with a correlated model (Gilmore Vol. I ch. 19)`
        : `project choice (default ${DEFAULT_TEMPERATURE_MARGIN_C} K per MIL-STD-1540)`;
  }
  return margins;
}

export interface CaseMaterial {
  name: string;
  absorptivityBol: number;
  emissivityBol: number;
  absorptivityEol: number;
  emissivityEol: number;
  source: string;
}

/** The absorptivity and emissivity of a material in a property set. */
export const opticalProperties = (m: CaseMaterial, set: PropertySet): { absorptivity: number; emissivity: number } =>
  set === 'eol' ? { absorptivity: m.absorptivityEol, emissivity: m.emissivityEol } : { absorptivity: m.absorptivityBol, emissivity: m.emissivityBol };
