// The orbit editor's fields, and turning what was typed into a compute request (for the live
// preview) and into an orbit to save (as typed, for the server to read authoritatively).
import { FormControl, FormGroup, NonNullableFormBuilder } from '@angular/forms';
import type { BodySummaryResponse, EnvironmentRequestInput } from '../../../shared/api/environment';
import type { Orbit, OrbitCreate } from '../../../shared/api/missions';
import { quantityForServer, readQuantityText, type FieldUnit } from '../missions/quantity-text';

export type OrbitDefinition = 'altitudes' | 'semi-major-axis' | 'period';

export type NumberField = 'periapsisAltitude' | 'apoapsisAltitude' | 'semiMajorAxis' | 'eccentricity' | 'period' | 'inclination' | 'raan' | 'argPeriapsis';
export type OrbitField = NumberField | 'name' | 'epoch';

type ApiKey = Exclude<keyof OrbitCreate, 'name' | 'epoch'>;

interface NumberFieldSpec {
  readonly label: string;
  readonly apiKey: ApiKey;
  /** Shown as the suffix; a bare number is in it. null: a pure number (eccentricity). */
  readonly unit: FieldUnit | null;
  /** The unit of the API field (periodS is seconds even though the form shows minutes). */
  readonly serverUnit: FieldUnit | null;
}

export const NUMBER_FIELDS: Readonly<Record<NumberField, NumberFieldSpec>> = {
  periapsisAltitude: { label: 'Periapsis altitude', apiKey: 'periapsisAltitudeKm', unit: 'km', serverUnit: 'km' },
  apoapsisAltitude: { label: 'Apoapsis altitude', apiKey: 'apoapsisAltitudeKm', unit: 'km', serverUnit: 'km' },
  semiMajorAxis: { label: 'Semi-major axis', apiKey: 'semiMajorAxisKm', unit: 'km', serverUnit: 'km' },
  eccentricity: { label: 'Eccentricity', apiKey: 'eccentricity', unit: null, serverUnit: null },
  period: { label: 'Period', apiKey: 'periodS', unit: 'min', serverUnit: 's' },
  inclination: { label: 'Inclination', apiKey: 'inclinationDeg', unit: 'deg', serverUnit: 'deg' },
  raan: { label: 'RAAN', apiKey: 'raanDeg', unit: 'deg', serverUnit: 'deg' },
  argPeriapsis: { label: 'Argument of periapsis', apiKey: 'argPeriapsisDeg', unit: 'deg', serverUnit: 'deg' },
};

export const SHAPE_FIELDS: Readonly<Record<OrbitDefinition, readonly NumberField[]>> = {
  altitudes: ['periapsisAltitude', 'apoapsisAltitude'],
  'semi-major-axis': ['semiMajorAxis', 'eccentricity'],
  period: ['period', 'eccentricity'],
};
export const ORIENTATION_FIELDS: readonly NumberField[] = ['inclination', 'raan', 'argPeriapsis'];

export type OrbitFormGroup = FormGroup<{
  name: FormControl<string>;
  epoch: FormControl<string>;
  definition: FormControl<OrbitDefinition>;
  periapsisAltitude: FormControl<string>;
  apoapsisAltitude: FormControl<string>;
  semiMajorAxis: FormControl<string>;
  eccentricity: FormControl<string>;
  period: FormControl<string>;
  inclination: FormControl<string>;
  raan: FormControl<string>;
  argPeriapsis: FormControl<string>;
}>;
export type OrbitFormValue = ReturnType<OrbitFormGroup['getRawValue']>;

export function buildOrbitForm(fb: NonNullableFormBuilder): OrbitFormGroup {
  return fb.group({
    name: '',
    epoch: '',
    definition: fb.control<OrbitDefinition>('altitudes'),
    periapsisAltitude: '',
    apoapsisAltitude: '',
    semiMajorAxis: '',
    eccentricity: '0',
    period: '',
    inclination: '0',
    raan: '0',
    argPeriapsis: '0',
  });
}

/** The form's starting values: a saved orbit as it was typed, or a new one at the mission's start. */
export function initialOrbitValue(orbit: Orbit | null, missionStartDate: string): OrbitFormValue {
  const typed = (key: ApiKey, fallback: string): string => {
    const value = orbit?.input[key];
    return value === undefined ? fallback : String(value);
  };
  const definition: OrbitDefinition = orbit?.definition ?? 'altitudes';
  return {
    name: orbit?.name ?? '',
    epoch: orbit?.epoch ?? `${missionStartDate}T00:00:00Z`,
    definition,
    periapsisAltitude: typed('periapsisAltitudeKm', ''),
    apoapsisAltitude: typed('apoapsisAltitudeKm', ''),
    semiMajorAxis: typed('semiMajorAxisKm', ''),
    eccentricity: typed('eccentricity', '0'),
    // Shown in minutes; a saved bare number is seconds.
    period: typeof orbit?.input['periodS'] === 'number' ? `${orbit.input['periodS']} s` : typed('periodS', ''),
    inclination: typed('inclinationDeg', '0'),
    raan: typed('raanDeg', '0'),
    argPeriapsis: typed('argPeriapsisDeg', '0'),
  };
}

export type FieldProblems = Partial<Record<OrbitField, string>>;

export interface OrbitReading {
  /** Numbers in the API's units (km, s, deg), for the compute route. */
  readonly orbit: EnvironmentRequestInput['orbit'];
  readonly problems: FieldProblems;
}

const ISO_DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/;
const fmt = (v: number): string => String(Math.round(v * 1000) / 1000);

/** Reads the fields the chosen definition uses, with the checks that need no server. */
export function readOrbitForm(value: OrbitFormValue, body: BodySummaryResponse): OrbitReading {
  const problems: FieldProblems = {};
  const numbers: Partial<Record<NumberField, number>> = {};
  for (const field of [...SHAPE_FIELDS[value.definition], ...ORIENTATION_FIELDS]) {
    const spec = NUMBER_FIELDS[field];
    const text = value[field];
    if (spec.unit === null) {
      const n = Number(text.trim());
      if (text.trim() === '' || !Number.isFinite(n)) problems[field] = `${spec.label.toLowerCase()} is a plain number, e.g. 0.001`;
      else numbers[field] = n;
      continue;
    }
    const reading = readQuantityText(text, spec.unit);
    if (!reading.ok) problems[field] = reading.message;
    else numbers[field] = reading.value;
  }
  const { periapsisAltitude: hp, apoapsisAltitude: ha, eccentricity: e, semiMajorAxis: a, period, inclination } = numbers;
  if (hp !== undefined && hp < 0) problems.periapsisAltitude = `periapsis is ${fmt(-hp)} km below the surface of ${body.name}`;
  if (hp !== undefined && ha !== undefined && ha < hp) problems.apoapsisAltitude = `apoapsis is below periapsis by ${fmt(hp - ha)} km`;
  if (e !== undefined && (e < 0 || e >= 1)) problems.eccentricity = `eccentricity is 0 up to (not including) 1; got ${fmt(e)}`;
  if (a !== undefined && e !== undefined && e >= 0 && e < 1 && a * (1 - e) < body.radiusKm) {
    problems.semiMajorAxis = `periapsis would be ${fmt(body.radiusKm - a * (1 - e))} km below the surface of ${body.name} (radius ${fmt(body.radiusKm)} km)`;
  }
  if (period !== undefined && period <= 0) problems.period = 'the period must be above 0 min';
  if (inclination !== undefined && (inclination < 0 || inclination > 180)) {
    problems.inclination = `inclination is 0..180 deg; ${fmt(inclination)} deg is ${fmt(inclination < 0 ? -inclination : inclination - 180)} deg outside`;
  }
  if (!ISO_DATE_TIME.test(value.epoch.trim()) || Number.isNaN(Date.parse(value.epoch.trim()))) {
    problems.epoch = 'the epoch is an ISO 8601 date and time with its offset, e.g. 2027-03-20T12:00:00Z';
  }
  const orbit: EnvironmentRequestInput['orbit'] = {
    inclinationDeg: numbers.inclination,
    raanDeg: numbers.raan,
    argPeriapsisDeg: numbers.argPeriapsis,
  };
  if (value.definition === 'altitudes') Object.assign(orbit, { periapsisAltitudeKm: hp, apoapsisAltitudeKm: ha });
  else if (value.definition === 'semi-major-axis') Object.assign(orbit, { semiMajorAxisKm: a, eccentricity: e });
  else Object.assign(orbit, { periodS: period === undefined ? undefined : period * 60, eccentricity: e });
  return { orbit, problems };
}

/** The preview request: the epoch sets the Sun (no betaDeg), one nadir plate, 180 steps. */
export function previewRequest(bodyId: BodySummaryResponse['id'], reading: OrbitReading, epoch: string): EnvironmentRequestInput {
  return {
    bodyId,
    orbit: reading.orbit,
    epoch: epoch.trim(),
    steps: 180,
    surfaces: [{ name: 'preview plate', normal: 'nadir', areaM2: 1, absorptivity: 0.5, emissivity: 0.5 }],
  };
}

/** The orbit to save: the chosen definition's fields as typed (units included). */
export function orbitToSave(value: OrbitFormValue): OrbitCreate {
  const saved: OrbitCreate = { name: value.name.trim(), epoch: value.epoch.trim() };
  for (const field of [...SHAPE_FIELDS[value.definition], ...ORIENTATION_FIELDS]) {
    const spec = NUMBER_FIELDS[field];
    if (spec.apiKey === 'eccentricity') saved.eccentricity = Number(value[field].trim());
    else saved[spec.apiKey] = quantityForServer(value[field], spec.unit ?? 'km', spec.serverUnit ?? 'km');
  }
  return saved;
}

const FIELD_OF_API_KEY: Readonly<Record<string, OrbitField>> = {
  name: 'name',
  epoch: 'epoch',
  ...Object.fromEntries(Object.entries(NUMBER_FIELDS).map(([field, spec]) => [spec.apiKey, field])),
};

/** The form field an error detail's path names ("orbit.periodS", "periapsisAltitudeKm"), if any. */
export function fieldOfPath(path: string | undefined): OrbitField | null {
  if (!path) return null;
  const key = path.replace(/^orbit\./, '');
  return FIELD_OF_API_KEY[key] ?? null;
}
