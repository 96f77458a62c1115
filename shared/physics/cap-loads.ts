// Which albedo and planetary-IR models an orbit's loads use, and those loads on an orbit grid by
// quadrature over the cap each plate sees (cap-radiance.ts): the Lambertian albedo integral and an
// airless body's surface temperature field, in columns profile-loads.ts takes in place of its
// closed forms.
// Defaults (stated in every answer's assumptions): an airless body (bodies.ts `airless`) gets its
// temperature field and the Lambertian albedo integral; a body with an atmosphere keeps a uniform
// OLR, and the engineering albedo S a F cos(theta_subsolar) unless the orbit reaches beyond one body
// radius of altitude, where that approximation errs by tens of percent (+35 % at the GEO albedo
// peak; DOMAIN.md), and the Lambertian integral is used. Either albedo model can be asked for.
// Leaves out: what cap-radiance.ts leaves out.
import type { Body } from './bodies';
import { capNodes, floorExitanceWm2, meanExitanceWm2, plateFluxes, plateNodes, spinPlateNodes, surfaceTemperatureK, type CapNodes, type PlateNodes, type SurfaceField } from './cap-radiance';
import type { GridShade, OrbitGrid } from './orbit-grid';
import { pointingColumns, type PointingPlan } from './pointing';
import type { PreparedSurface } from './surface-grid';

export const albedoModels = ['lambertian', 'subsolar-cosine'] as const;
export type AlbedoModel = (typeof albedoModels)[number];
export const irModels = ['surface-temperature', 'uniform'] as const;
export type IrModel = (typeof irModels)[number];

/**
 * The coarser node grid of the paths that integrate the cap many times over (the mission sweep's
 * days, an ephemeris's rows): within about 1 % of the default 20 x 48 (mission-sweep.spec.ts,
 * trajectory-environment.spec.ts).
 */
export const COARSE_CAP_NODES = { radial: 10, azimuth: 24 } as const;

/** Beyond this apoapsis altitude, in body radii, the engineering albedo approximation is not the default. */
export const LAMBERTIAN_ALTITUDE_RADII = 1;

export interface CapModelChoice {
  albedoModel: AlbedoModel;
  irModel: IrModel;
  /** The airless field when irModel is surface-temperature. */
  field: SurfaceField | null;
}

export interface CapModelRequest {
  albedoModel?: AlbedoModel | undefined;
  irModel?: IrModel | undefined;
  albedo?: number | undefined;
  olrWm2?: number | undefined;
  surfaceEmissivity?: number | undefined;
  nightFloorK?: number | undefined;
}

/** The models of one computation: the request's choice, else the defaults above. */
export function chooseCapModels(body: Body, request: CapModelRequest, albedo: number, apoapsisAltitudeKm: number): CapModelChoice {
  const airless = body.airless;
  // An OLR given for an airless body asks for the uniform model, as before the field existed.
  const irModel: IrModel = request.irModel ?? (airless && request.olrWm2 === undefined ? 'surface-temperature' : 'uniform');
  const field: SurfaceField | null = irModel === 'surface-temperature'
    ? {
      bondAlbedo: albedo,
      emissivity: request.surfaceEmissivity ?? airless?.emissivity.nominal ?? 0.95,
      nightFloorK: request.nightFloorK ?? airless?.nightFloorK.nominal ?? 0,
    }
    : null;
  const high = apoapsisAltitudeKm > LAMBERTIAN_ALTITUDE_RADII * body.radiusKm;
  const albedoModel: AlbedoModel = request.albedoModel ?? (airless || high ? 'lambertian' : 'subsolar-cosine');
  return { albedoModel, irModel, field };
}

/** The assumption lines for the models in use (they replace the closed-form albedo and IR lines). */
export function capAssumptions(choice: CapModelChoice, solarFluxWm2: number): string[] {
  const albedo = choice.albedoModel === 'lambertian'
    ? 'albedo load = the Lambertian integral of a S cos(z) over the sunlit part of the cap the plate sees (numerical quadrature, within 1 % of a brute-force integration)'
    : 'albedo load = S * albedo * F * cos(solar zenith at the sub-spacecraft point) on the sunlit side: a common engineering approximation';
  const field = choice.field;
  const ir = field
    ? `planetary IR from the surface temperature field of an airless body: day side in radiative equilibrium with the Sun, T = [S (1 - A) cos z / (eps sigma)]^(1/4) ` +
      `(subsolar ${surfaceTemperatureK(field, solarFluxWm2, 1).toFixed(0)} K with A = ${field.bondAlbedo}, eps = ${field.emissivity}), ` +
      `night side at ${field.nightFloorK} K; no thermal inertia; integrated over the cap each plate sees`
    : 'planetary IR = OLR * F, with F the plate-to-sphere view factor (Howell catalogue)';
  return [albedo, ir];
}

/** The uniform OLR an answer reports: the field's whole-body mean exitance, or the OLR itself. */
export const reportedOlrWm2 = (choice: CapModelChoice, solarFluxWm2: number, olrWm2: number): number =>
  choice.field ? meanExitanceWm2(choice.field, solarFluxWm2) : olrWm2;

/** Per-surface albedo and IR columns from the cap quadrature; null for a component a closed form gives. */
export interface CapColumns {
  albedoWm2: Float64Array[] | null;
  irWm2: Float64Array[] | null;
}

/** Whether the chosen models need the cap quadrature (else both closed forms apply). */
export const needsCap = (choice: CapModelChoice): boolean => choice.albedoModel === 'lambertian' || choice.field !== null;

/** The cap nodes of the plates at one sample: null for a moving plate (its nodes move with its normal). */
export interface SampleNodes {
  cap: CapNodes;
  plates: (PlateNodes | null)[];
}

/**
 * The quadrature nodes of every plate along an orbit grid. Rebuilt when the radius changes from one
 * sample to the next (a circular orbit builds them once); with `keepAll` every sample's are kept, so a
 * sweep that uses the same grid day after day builds them once (for small grids only: memory grows
 * with samples x plates x nodes). Coarser grids than the default may be asked for.
 */
export function capGridNodes(
  prepared: readonly PreparedSurface[], grid: OrbitGrid, bodyRadiusKm: number,
  options: { keepAll?: boolean; radial?: number; azimuth?: number } = {},
): (k: number) => SampleNodes {
  const kept: (SampleNodes | undefined)[] = options.keepAll ? new Array(grid.steps) : [];
  let last: SampleNodes | null = null;
  let lastRadius = Number.NaN;
  return (k) => {
    const r = grid.radiusKm[k];
    if (r === lastRadius && last) return last;
    const found = options.keepAll ? kept[k] : undefined;
    if (found) return found;
    const cap = capNodes(r / bodyRadiusKm, options.radial, options.azimuth);
    const nodes: SampleNodes = { cap, plates: prepared.map((p) => (p.normal ? plateNodes(cap, p.normal[0], p.normal[1], p.normal[2]) : null)) };
    if (options.keepAll) kept[k] = nodes;
    last = nodes;
    lastRadius = r;
    return nodes;
  };
}

/** The exitances plateFluxes takes: a S, the day side's S (1 - A) under a zenith Sun, the night floor's (0, 0 without a field). */
export function capExitances(choice: CapModelChoice, solarFluxWm2: number, albedo: number): { reflected: number; day: number; floor: number } {
  const field = choice.field;
  return { reflected: solarFluxWm2 * albedo, day: field ? solarFluxWm2 * (1 - field.bondAlbedo) : 0, floor: field ? floorExitanceWm2(field) : 0 };
}

/** The cap nodes of a plan's plate whose normal (a spinner's axis) is (nx, ny, nz) at this instant. */
export function pointingPlateNodes(plan: PointingPlan, cap: CapNodes, nx: number, ny: number, nz: number): PlateNodes {
  const spin = plan.spin;
  return spin ? spinPlateNodes(cap, nx, ny, nz, spin.cos, spin.sin) : plateNodes(cap, nx, ny, nz);
}

/** Cap-quadrature columns for the chosen models, or null when both closed forms apply. */
export function capColumns(
  choice: CapModelChoice, prepared: readonly PreparedSurface[], grid: OrbitGrid, shade: GridShade, sunW: number,
  bodyRadiusKm: number, solarFluxWm2: number, albedo: number,
  nodesAt: (k: number) => SampleNodes = capGridNodes(prepared, grid, bodyRadiusKm),
): CapColumns | null {
  const lambertian = choice.albedoModel === 'lambertian';
  const field = choice.field;
  if (!needsCap(choice)) return null;
  const steps = grid.steps;
  const columns = () => prepared.map(() => new Float64Array(steps));
  const albedoWm2 = columns();
  const irWm2 = columns();
  const { reflected, day, floor } = capExitances(choice, solarFluxWm2, albedo);
  const out = new Float64Array(2);
  // a moving plate's normal (a spinner's axis) at every sample (pointing.ts)
  const moving = prepared.map((p) => (p.plan ? pointingColumns(p.plan, grid, shade, sunW, bodyRadiusKm) : null));
  for (let k = 0; k < steps; k++) {
    const { cap, plates } = nodesAt(k);
    const sx = shade.cx[k];
    const sz = shade.cz[k];
    for (let j = 0; j < prepared.length; j++) {
      const m = moving[j];
      // a moving plate's nodes move with its normal
      const plate = plates[j] ?? (m ? pointingPlateNodes(prepared[j].plan!, cap, m.nx[k], m.ny[k], m.nz[k]) : null)!;
      plateFluxes(plate, sx, sunW, sz, reflected, day, floor, out);
      albedoWm2[j][k] = out[0];
      irWm2[j][k] = out[1];
    }
  }
  return { albedoWm2: lambertian ? albedoWm2 : null, irWm2: field ? irWm2 : null };
}
