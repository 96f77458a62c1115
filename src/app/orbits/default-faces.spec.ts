// The default faces of the environment tab (issue 17): six body-frame faces and a Sun-pointing plate
// asked of the compute route with the saved orbit. Common practice, no source.
import { describe, expect, it } from 'vitest';
import { environmentRequest, type EnvironmentResponse } from '../../../shared/api/environment';
import { DEFAULT_FACES, defaultFacesRequest, faceAverages } from './default-faces';

const orbit = { semiMajorAxisKm: 6918.137, eccentricity: 0.001, inclinationDeg: 97.5, raanDeg: 10, argPeriapsisDeg: 90, epoch: '2027-03-20T12:00:00Z' };

describe('defaultFacesRequest', () => {
  it('asks for the six faces of the local orbital frame, ±x ±y ±z, and a plate facing the Sun', () => {
    const request = defaultFacesRequest({ bodyId: 'earth' }, orbit, 'time');
    const normals = request.surfaces.map((s) => s.normal);
    expect(normals).toEqual(['ram', 'wake', 'orbit-normal', 'anti-orbit-normal', 'zenith', 'nadir', 'sun']);
    expect(new Set(request.surfaces.map((s) => s.name)).size).toBe(DEFAULT_FACES.length);
  });

  it("is a request the compute route's schema accepts, with the saved orbit, its epoch and its sampling", () => {
    const request = defaultFacesRequest({ bodyId: 'earth' }, orbit, 'eccentric-anomaly');
    const parsed = environmentRequest.parse(request);
    expect(parsed.orbit).toMatchObject({ semiMajorAxisKm: 6918.137, eccentricity: 0.001, inclinationDeg: 97.5, raanDeg: 10, argPeriapsisDeg: 90 });
    expect(parsed.epoch).toBe('2027-03-20T12:00:00Z');
    expect(parsed.sampling).toBe('eccentric-anomaly');
    expect(parsed.steps).toBe(360);
  });
});

describe('faceAverages', () => {
  it('adds solar, albedo and planetary IR into the incident total of each face', () => {
    const answer = { orbitAverage: { surfaces: [{ name: 'Nadir face (−z)', solarWm2: 10, albedoWm2: 90.5, irWm2: 220, absorbedW: 320.5 }] } } as unknown as EnvironmentResponse;
    expect(faceAverages(answer)).toEqual([{ name: 'Nadir face (−z)', solarWm2: 10, albedoWm2: 90.5, irWm2: 220, totalWm2: 320.5 }]);
  });
});
