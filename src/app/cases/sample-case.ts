import type { CaseDetail } from '../../../shared/api/cases';

/** A small, made-up case for the specs of the case screens (two surfaces, four samples). */
export function sampleCase(overrides: Partial<CaseDetail> = {}): CaseDetail {
  const load = { solarWm2: 400, albedoWm2: 80, irWm2: 200, solarW: 20, albedoW: 4, irW: 10, absorbedW: 34 };
  const surface = (name: string) => ({
    name,
    areaM2: 0.5,
    absorptivity: 0.2,
    emissivity: 0.8,
    series: {
      solarWm2: [1361, 1361, 0, 0], albedoWm2: [100, 50, 0, 0], irWm2: [220, 220, 220, 220],
      solarW: [40, 40, 0, 0], albedoW: [3, 1.5, 0, 0], irW: [9, 9, 9, 9], absorbedW: [52, 50.5, 9, 9],
    },
    orbitAverage: { ...load, absorbedWithMarginW: 42.5 },
    peak: load,
  });
  return {
    id: 'case-1',
    missionId: 'mission-1',
    missionName: 'Kestrel-1 imaging smallsat',
    workspaceId: 'ws-1',
    seriesId: 'series-1',
    name: 'Operational hot',
    kind: 'hot',
    status: 'draft',
    revision: 1,
    checksum: null,
    author: { id: 'u1', name: 'Thermal Engineer', email: 'thermal@kestrel.test' },
    releasedBy: null,
    releasedAt: null,
    orbitAverageAbsorbedW: 68,
    betaDeg: 12.5,
    version: 1,
    createdAt: '2027-05-01T10:00:00.000Z',
    updatedAt: '2027-05-01T10:00:00.000Z',
    submittedBy: null,
    submittedAt: null,
    subscribed: false,
    actions: ['edit', 'submit', 'comment'],
    comments: [],
    inputChanges: [],
    currentInputsBlocked: null,
    inputsChanged: false,
    caution: 'Preliminary-design estimate from simplified models.',
    inputs: {
      mission: { id: 'mission-1', name: 'Kestrel-1 imaging smallsat', startDate: '2027-04-01', endDate: '2031-12-31', crewed: false },
      body: {
        id: 'earth', name: 'Earth', gmKm3S2: 398600.4418, radiusKm: 6378.137, j2: 1.08263e-3,
        solarDistanceAu: { mean: 1, min: 0.983, max: 1.017 },
        albedo: { min: 0.06, nominal: 0.306, max: 0.5 },
        olrWm2: { min: 110, nominal: 240, max: 350 },
        provisional: true,
        sources: { gmKm3S2: 'made up for the spec' },
      },
      orbit: {
        id: 'orbit-1', name: 'Operational SSO 540 km', epoch: '2027-04-20T00:00:00Z', periapsisAltitudeKm: 540, apoapsisAltitudeKm: 540,
        semiMajorAxisKm: 6918.137, eccentricity: 0, periodS: 5730, inclinationDeg: 97.5, raanDeg: 160, argPeriapsisDeg: 0,
      },
      attitude: 'nadir pointing',
      conditions: {
        bodyId: 'earth',
        orbit: { semiMajorAxisKm: 6918.137, eccentricity: 0, inclinationDeg: 97.5, raanDeg: 160, argPeriapsisDeg: 0 },
        orbitEpoch: '2027-04-20T00:00:00Z', date: '2028-01-03', betaDeg: 12.5, solarDistanceAu: 0.983, albedo: 0.35, olrWm2: 250,
        properties: 'eol', marginDirection: 'increase', steps: 4, surfaces: [],
      },
      environmentSource: 'made up for the spec',
      provisional: true,
      margins: { heatLoadPercent: 25, temperatureMarginC: 17, sources: { heatLoadPercent: 'default', temperatureMarginC: 'default' } },
      rationale: ['Perihelion Sun drove it: 0.983 AU on 2028-01-03.'],
      surfaceDrivers: [],
      scan: null,
      assumptions: [],
    },
    results: {
      periodS: 5730, betaDeg: 12.5, solarFluxWm2: 1408, eclipseFraction: 0.35, eclipseDurationS: 2000, umbraDurationS: 1950, penumbraDurationS: 50,
      tS: [0, 1432, 2865, 4297], sunlit: [1, 1, 0, 0],
      surfaces: [surface('Radiator'), surface('Array')],
      total: { orbitAverageAbsorbedW: 68, orbitAverageWithMarginW: 85, peakAbsorbedW: 104 },
    },
    ...overrides,
  };
}
