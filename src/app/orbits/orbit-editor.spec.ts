import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { BodySummaryResponse, EnvironmentResponse } from '../../../shared/api/environment';
import { OrbitEditor } from './orbit-editor';

// Earth's GM and equatorial radius as in IERS Conventions (2010), table 1.1.
const earth: BodySummaryResponse = {
  id: 'earth',
  name: 'Earth',
  kind: 'planet',
  planetId: 'earth',
  gmKm3S2: 398600.4418,
  radiusKm: 6378.137,
  j2: 0.00108263,
  poleRaDeg: 0,
  poleDecDeg: 90,
  solarDistanceAu: { mean: 1, min: 0.983, max: 1.017 },
  albedo: { min: 0.2, nominal: 0.3, max: 0.4 },
  olrWm2: { min: 200, nominal: 237, max: 260 },
  provisional: true,
  airless: false,
  surfaceField: null,
  sources: {},
};

/** A compute answer as the server shapes it; these numbers only pass through to the screen. */
function answer(overrides: Partial<EnvironmentResponse>): EnvironmentResponse {
  return {
    bodyId: 'earth', periodS: 5739, semiMajorAxisKm: 6928.137, eccentricity: 0, periapsisAltitudeKm: 550,
    apoapsisAltitudeKm: 550, betaDeg: 21.4, epochBetaDeg: 21.4, sunDirection: { x: 0.9311, y: 0, z: 0.3649 }, solarDistanceAu: 0.996, solarFluxWm2: 1375,
    albedo: 0.3, olrWm2: 237, eclipseFraction: 0.372, eclipseDurationS: 2136, umbraDurationS: 2120,
    penumbraDurationS: 16, nodalRateDegPerDay: 0, albedoModel: 'subsolar-cosine', irModel: 'uniform', sampling: 'time', surfaceField: null,
    parentBodyId: null, parentShadowDurationS: 0, warnings: [], profile: [], sampleWeightsS: null, orbitAverage: { surfaces: [] }, peak: { surfaces: [] },
    assumptions: [], ...overrides,
  };
}

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

async function render() {
  TestBed.configureTestingModule({ imports: [OrbitEditor], providers: [provideHttpClient(), provideHttpClientTesting()] });
  const fixture = TestBed.createComponent(OrbitEditor);
  fixture.componentRef.setInput('missionId', 'm-1');
  fixture.componentRef.setInput('missionStartDate', '2027-03-20');
  fixture.componentRef.setInput('body', earth);
  await fixture.whenStable();
  const element: HTMLElement = fixture.nativeElement;
  const http = TestBed.inject(HttpTestingController);
  const type = (testId: string, value: string) => {
    const input = element.querySelector<HTMLInputElement>(`[data-testid="${testId}"]`);
    if (!input) throw new Error(`no ${testId}`);
    input.value = value;
    input.dispatchEvent(new Event('input'));
  };
  const text = (testId: string) => element.querySelector(`[data-testid="${testId}"]`)?.textContent?.trim() ?? '';
  const settle = async () => {
    await sleep(350);
    await fixture.whenStable();
  };
  return { fixture, element, http, type, text, settle };
}

describe('OrbitEditor', () => {
  it('asks the compute route once, ~300 ms after the typing stops, with the units converted', async () => {
    const page = await render();
    page.type('orbit-periapsisAltitude', '5');
    page.type('orbit-periapsisAltitude', '550 km');
    page.type('orbit-apoapsisAltitude', '341.8 mi');
    page.http.expectNone('/api/v1/environment/compute');
    await page.settle();

    const request = page.http.expectOne('/api/v1/environment/compute');
    const body = request.request.body as Record<string, unknown>;
    expect(body['bodyId']).toBe('earth');
    expect(body['epoch']).toBe('2027-03-20T00:00:00Z');
    expect(body['steps']).toBe(180);
    expect('betaDeg' in body).toBe(false); // the epoch sets the Sun
    const orbit = body['orbit'] as Record<string, number>;
    expect(orbit['periapsisAltitudeKm']).toBe(550);
    expect(orbit['apoapsisAltitudeKm']).toBeCloseTo(341.8 * 1.609344, 9); // 1 mi = 1.609344 km (NIST SP 811)

    request.flush(answer({}));
    await page.fixture.whenStable();
    expect(page.text('figure-period')).toBe('95.65 min');
    expect(page.text('figure-eclipse-duration')).toBe('35.6 min');
    // Vis-viva at 550 km circular: sqrt(398600.4418 / 6928.137) = 7.585 km/s (worked by hand).
    expect(page.text('orbit-derived')).toContain('7.585 km/s');
    page.http.verify();
  });

  it('says by how much the apoapsis is below the periapsis, without asking the server', async () => {
    const page = await render();
    page.type('orbit-periapsisAltitude', '600');
    page.type('orbit-apoapsisAltitude', '550 km');
    await page.settle();
    page.http.expectNone('/api/v1/environment/compute');
    expect(page.text('error-apoapsisAltitude')).toBe('apoapsis is below periapsis by 50 km');
    expect(page.text('error-periapsisAltitude')).toBe('');
  });

  it("puts the server's 422 detail under the field its path names", async () => {
    const page = await render();
    page.element.querySelector<HTMLButtonElement>('[data-testid="definition-period"] button')?.click();
    await page.fixture.whenStable();
    page.type('orbit-period', '20 min');
    page.type('orbit-eccentricity', '0');
    await page.settle();
    const request = page.http.expectOne('/api/v1/environment/compute');
    expect((request.request.body as { orbit: Record<string, number> }).orbit['periodS']).toBe(1200);
    const message = 'a period of 1200 s (20.0 min) is shorter than the shortest possible orbit around Earth at eccentricity 0: 5060 s (84.3 min)';
    request.flush(
      { error: { code: 'impossible_orbit', message, details: [{ path: 'orbit.periodS', message }] } },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await page.fixture.whenStable();
    expect(page.text('error-period')).toBe(message);
    expect(page.text('orbit-preview-error')).toBe('');
  });

  it('saves the text as typed and shows a refused field in place', async () => {
    const page = await render();
    page.type('orbit-name', 'Science orbit');
    page.type('orbit-periapsisAltitude', '550 km');
    page.type('orbit-apoapsisAltitude', '550');
    page.element.querySelector<HTMLButtonElement>('[data-testid="orbit-save"]')?.click();
    await page.fixture.whenStable();
    const save = page.http.expectOne((r) => r.url === '/api/v1/missions/m-1/orbits' && r.method === 'POST');
    expect(save.request.body).toEqual({
      name: 'Science orbit',
      epoch: '2027-03-20T00:00:00Z',
      periapsisAltitudeKm: '550 km',
      apoapsisAltitudeKm: 550,
      inclinationDeg: 0,
      raanDeg: 0,
      argPeriapsisDeg: 0,
    });
    save.flush(
      { error: { code: 'invalid', message: 'The request is not valid.', details: [{ path: 'epoch', message: 'the epoch is after the mission ends' }] } },
      { status: 400, statusText: 'Bad Request' },
    );
    await page.fixture.whenStable();
    expect(page.text('error-epoch')).toBe('the epoch is after the mission ends');
    expect(page.text('orbit-save-error')).toBe('');
  });
});
