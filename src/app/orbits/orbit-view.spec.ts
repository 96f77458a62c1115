// The orbit view draws the Sun from the answer's sunDirection for every orbit, eclipse or not:
// the frame is turned so the Sun's in-plane direction points left, where its pointer is drawn.
import { TestBed } from '@angular/core/testing';
import { describe, expect, it } from 'vitest';
import type { EnvironmentResponse } from '../../../shared/api/environment';
import { OrbitView } from './orbit-view';

// An eccentric Earth orbit (a = 20000 km, e = 0.6) high above the orbit plane's Sun: no sample in shadow.
const answer = (sunDirection: EnvironmentResponse['sunDirection']): EnvironmentResponse =>
  ({
    bodyId: 'earth', periodS: 28142, semiMajorAxisKm: 20000, eccentricity: 0.6, periapsisAltitudeKm: 1622, apoapsisAltitudeKm: 25622,
    betaDeg: (Math.asin(sunDirection.z) * 180) / Math.PI, epochBetaDeg: null, sunDirection,
    eclipseFraction: 0, eclipseDurationS: 0, umbraDurationS: 0, penumbraDurationS: 0,
    profile: Array.from({ length: 36 }, (_, k) => ({ tS: k * 780, trueAnomalyDeg: k * 10, sunlit: 1, surfaces: [] })),
  }) as unknown as EnvironmentResponse;

async function periapsisFromCentre(sunDirection: EnvironmentResponse['sunDirection']): Promise<{ dx: number; dy: number }> {
  const fixture = TestBed.createComponent(OrbitView);
  fixture.componentRef.setInput('answer', answer(sunDirection));
  fixture.componentRef.setInput('bodyName', 'Earth');
  fixture.componentRef.setInput('bodyRadiusKm', 6378);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const body = el.querySelector('circle.body') as SVGCircleElement;
  const marker = el.querySelector('g.periapsis rect') as SVGRectElement;
  const [cx, cy] = [Number(body.getAttribute('cx')), Number(body.getAttribute('cy'))];
  const [px, py] = [Number(marker.getAttribute('x')) + 4, Number(marker.getAttribute('y')) + 4];
  return { dx: px - cx, dy: py - cy };
}

describe('OrbitView', () => {
  it('turns an eccentric orbit without eclipse so the Sun of sunDirection points left (Sun at periapsis: periapsis toward the Sun)', async () => {
    const toward = await periapsisFromCentre({ x: Math.cos(0.5), y: 0, z: Math.sin(0.5) });
    expect(toward.dx).toBeLessThan(0);
    expect(Math.abs(toward.dy)).toBeLessThan(1);
    const away = await periapsisFromCentre({ x: -1, y: 0, z: 0 });
    expect(away.dx).toBeGreaterThan(0);
    // Sun 90° along the motion from periapsis: turned by +90°, periapsis drawn above the body (SVG y down)
    const side = await periapsisFromCentre({ x: 0, y: 1, z: 0 });
    expect(side.dy).toBeLessThan(0);
    expect(Math.abs(side.dx)).toBeLessThan(1);
  });
});
