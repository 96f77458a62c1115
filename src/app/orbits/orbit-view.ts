// A picture of the orbit around its body, seen from above the orbit plane (down the orbit normal):
// the body's disk, the ellipse, the Sun's direction (always drawn to the left), the body's shadow in
// the plane, the shaded arcs, periapsis, and the spacecraft at the sample the user scrubs to.
import { ChangeDetectionStrategy, Component, computed, input, model } from '@angular/core';
import type { EnvironmentResponse } from '../../../shared/api/environment';
import {
  orbitOutline,
  orbitPoint,
  pathThrough,
  sampleKind,
  shadedArcs,
  shadowOutline,
  sunAzimuthDeg,
  type PlanePoint,
} from './orbit-view-geometry';

const SIZE = 360;
const PAD = 40;
const KIND_WORDS = { sunlit: 'in sunlight', eclipse: 'in eclipse' } as const;

@Component({
  selector: 'ecl-orbit-view',
  templateUrl: './orbit-view.html',
  styleUrl: './orbit-view.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrbitView {
  readonly answer = input.required<EnvironmentResponse>();
  readonly bodyName = input.required<string>();
  readonly bodyRadiusKm = input.required<number>();
  /** The planet a moon orbits, in words ("Jupiter"), or '' about a planet. */
  readonly parentName = input('');
  /** The profile sample shown; two-way, so the load plots' cursor can follow and lead it. */
  readonly index = model(0);

  protected readonly size = SIZE;

  /** The Sun's angle along the orbit from periapsis (deg), from the answer's Sun direction. */
  protected readonly sunDeg = computed(() => sunAzimuthDeg(this.answer().sunDirection));

  /** km → px: the Sun's direction turned to the left, y up, the ellipse and disk fitted into the frame. */
  private readonly frame = computed(() => {
    const { semiMajorAxisKm: a, eccentricity: e } = this.answer();
    const R = this.bodyRadiusKm();
    const turn = ((180 - this.sunDeg()) * Math.PI) / 180;
    const [c, s] = [Math.cos(turn), Math.sin(turn)];
    const outline = orbitOutline(a, e, 90);
    const turned = (p: PlanePoint): PlanePoint => ({ x: p.x * c - p.y * s, y: p.x * s + p.y * c });
    const extent = [...outline.map(turned), { x: R, y: R }, { x: -R, y: -R }];
    const [xmin, xmax] = [Math.min(...extent.map((p) => p.x)), Math.max(...extent.map((p) => p.x))];
    const [ymin, ymax] = [Math.min(...extent.map((p) => p.y)), Math.max(...extent.map((p) => p.y))];
    const scale = (SIZE - 2 * PAD) / Math.max(xmax - xmin, ymax - ymin);
    const [cx, cy] = [(xmin + xmax) / 2, (ymin + ymax) / 2];
    const toPx = (p: PlanePoint): PlanePoint => {
      const t = turned(p);
      return { x: SIZE / 2 + (t.x - cx) * scale, y: SIZE / 2 - (t.y - cy) * scale };
    };
    return { toPx, scale, reachKm: (2 * SIZE) / scale };
  });

  protected readonly drawing = computed(() => {
    const a = this.answer();
    const { toPx, scale, reachKm } = this.frame();
    const R = this.bodyRadiusKm();
    const centre = toPx({ x: 0, y: 0 });
    const periapsis = toPx(orbitPoint(a.semiMajorAxisKm, a.eccentricity, 0));
    return {
      centre,
      radiusPx: R * scale,
      orbit: pathThrough(orbitOutline(a.semiMajorAxisKm, a.eccentricity).map(toPx), true),
      shadow: pathThrough(shadowOutline(R, a.betaDeg, this.sunDeg(), reachKm).map(toPx), true),
      arcs: shadedArcs(a.profile, a.semiMajorAxisKm, a.eccentricity).map((arc) => ({ kind: arc.kind, d: pathThrough(arc.points.map(toPx)) })),
      periapsis,
      // the label stands outside the orbit, on the far side from the body, kept inside the frame
      periapsisLabel: (() => {
        const [dx, dy] = [periapsis.x - centre.x, periapsis.y - centre.y];
        const len = Math.hypot(dx, dy) || 1;
        const x = periapsis.x + (dx / len) * 14;
        const anchor = x > SIZE * 0.7 ? 'end' : x < SIZE * 0.3 ? 'start' : 'middle';
        const y = Math.min(SIZE - 6, Math.max(14, periapsis.y + (dy / len) * 14 + 4 + (anchor === 'middle' ? 0 : dy >= 0 ? 12 : -12)));
        // beside the Sun's pointer (left, mid-height) the label goes below the marker
        if (x < SIZE * 0.3 && Math.abs(periapsis.y - SIZE / 2) < 24) return { x: periapsis.x + 6, y: periapsis.y + 20, anchor: 'start' };
        return { x: Math.min(SIZE - 6, Math.max(6, x)), y, anchor };
      })(),
    };
  });

  private readonly shownIndex = computed(() => Math.max(0, Math.min(this.index(), this.answer().profile.length - 1)));

  protected readonly craft = computed(() => {
    const a = this.answer();
    const p = a.profile[this.shownIndex()];
    if (!p) return null;
    const at = this.frame().toPx(orbitPoint(a.semiMajorAxisKm, a.eccentricity, p.trueAnomalyDeg));
    const kind = sampleKind(p);
    const state = kind === 'parent-shadow' ? `in ${this.parentName() || 'the planet'}'s shadow` : KIND_WORDS[kind];
    const minutes = (p.tS / 60).toFixed(1);
    return { ...at, kind, state, minutes, anomaly: p.trueAnomalyDeg.toFixed(0), sunlitPercent: Math.round(p.sunlit * 100) };
  });

  protected readonly betaText = computed(() => `β = ${this.answer().betaDeg.toFixed(1)}°`);

  /** The picture in words, for screen readers. */
  protected readonly description = computed(() => {
    const a = this.answer();
    const shaded = a.profile.filter((p) => p.sunlit < 1).length;
    const beta = a.betaDeg;
    const sunSide = Math.abs(beta) < 0.05 ? 'in the orbit plane' : `${Math.abs(beta).toFixed(1)}° ${beta > 0 ? 'above' : 'below'} the orbit plane (beta)`;
    const craft = this.craft();
    return [
      `Orbit around ${this.bodyName()} seen from above its plane, periapsis at ${a.periapsisAltitudeKm.toFixed(0)} km altitude and apoapsis at ${a.apoapsisAltitudeKm.toFixed(0)} km.`,
      `The Sun is ${sunSide}.`,
      shaded > 0 ? `The shadow covers ${Math.round((100 * shaded) / Math.max(1, a.profile.length))} % of the samples.` : 'No part of the orbit is in shadow.',
      craft ? `Spacecraft ${craft.minutes} min after periapsis, true anomaly ${craft.anomaly}°, ${craft.state}.` : '',
    ].join(' ');
  });

  protected scrub(event: Event): void {
    const value = Number((event.target as HTMLInputElement).value);
    if (Number.isInteger(value)) this.index.set(value);
  }
}
