// The read-out cursor and the zoom every Eclipta plot shares (the time-series and strip plots): a
// pointer or the arrow keys move the cursor, a drag across the plot or the + and − keys zoom the
// x range, 0 or the reset button shows it all again, and each move is said to screen readers. The
// pure steps below hold the rules; PlotCursor keeps the state as signals for a component.
import { computed, linkedSignal, signal, type Signal, type WritableSignal } from '@angular/core';
import { nearestIndex, type XScale } from './plot-scales';

/** The sentence under every plot that tells keyboard users what the keys do. */
export const CURSOR_HINT =
  'Arrow keys move the read-out cursor, Shift with an arrow moves faster, Home and End jump to the ends, Escape hides it. ' +
  'Plus and minus zoom in and out around the cursor, 0 shows the whole range; drag across the plot to zoom to a range.';

/** The narrowest zoom, as a share of the whole range: below it a plot shows little more than a sample. */
export const MIN_ZOOM_FRACTION = 1 / 1000;
/** A drag shorter than this (px) is a click, not a zoom. */
export const MIN_DRAG_PX = 6;

type Range = readonly [number, number];

/** Anything with an x: plot points, or the sorted xs the cursor snaps to. */
export type Stop = { readonly x: number };

/**
 * Where a key puts the cursor: an x, 'hide' (Escape), or null for a key the cursor leaves alone.
 * With `stops` (sorted by x) the cursor snaps to them, an arrow moving about one pixel column of
 * the samples shown (Shift: ten); without, it moves freely in 1 % steps of the range shown (Shift:
 * 10 %). Home and End jump to the ends of the whole range; the first arrow press starts at an end.
 * The cursor may leave the range shown: the zoom then follows it (panToShow).
 */
export function cursorKeyTarget(
  key: string,
  shift: boolean,
  current: number | null,
  view: { readonly shown: Range; readonly full: Range; readonly columns: number },
  stops: readonly Stop[] | null,
): number | 'hide' | null {
  if (key === 'Escape') return 'hide';
  const { shown, full } = view;
  if (stops === null) {
    const step = ((shown[1] - shown[0]) / 100) * (shift ? 10 : 1);
    switch (key) {
      case 'ArrowRight':
        return current === null ? shown[0] : Math.min(full[1], current + step);
      case 'ArrowLeft':
        return current === null ? shown[1] : Math.max(full[0], current - step);
      case 'Home':
        return full[0];
      case 'End':
        return full[1];
      default:
        return null;
    }
  }
  const n = stops.length;
  if (n === 0) return null;
  const first = nearestIndex(stops, shown[0]);
  const last = nearestIndex(stops, shown[1]);
  const base = Math.max(1, Math.floor((last - first + 1) / Math.max(1, view.columns)));
  const step = shift ? base * 10 : base;
  const i = current === null ? -1 : nearestIndex(stops, current);
  switch (key) {
    case 'ArrowRight':
      return stops[i < 0 ? first : Math.min(n - 1, i + step)].x;
    case 'ArrowLeft':
      return stops[i < 0 ? last : Math.max(0, i - step)].x;
    case 'Home':
      return stops[0].x;
    case 'End':
      return stops[n - 1].x;
    default:
      return null;
  }
}

/**
 * The zoomed range between two x values (in either order), kept inside `full` and no narrower than
 * MIN_ZOOM_FRACTION of it; null when it would show the whole range (no zoom).
 */
export function zoomBetween(full: Range, a: number, b: number): Range | null {
  const span = full[1] - full[0];
  if (!(span > 0) || !Number.isFinite(a) || !Number.isFinite(b)) return null;
  let lo = Math.max(full[0], Math.min(a, b));
  let hi = Math.min(full[1], Math.max(a, b));
  const least = span * MIN_ZOOM_FRACTION;
  if (hi - lo < least) {
    const mid = (lo + hi) / 2;
    lo = mid - least / 2;
    hi = mid + least / 2;
    if (lo < full[0]) [lo, hi] = [full[0], full[0] + least];
    if (hi > full[1]) [lo, hi] = [full[1] - least, full[1]];
  }
  return lo <= full[0] && hi >= full[1] ? null : [lo, hi];
}

/**
 * Zooms `shown` by `factor` about `center` (factor 2: half as wide, 0.5: twice as wide), the centre
 * keeping its place on screen; clamped as zoomBetween.
 */
export function zoomAbout(full: Range, shown: Range, center: number, factor: number): Range | null {
  const c = Math.min(shown[1], Math.max(shown[0], center));
  const lo = c - (c - shown[0]) / factor;
  const hi = c + (shown[1] - c) / factor;
  if (hi - lo >= full[1] - full[0]) return null;
  // Zooming out near an edge slides the window inward rather than losing width.
  const shift = lo < full[0] ? full[0] - lo : hi > full[1] ? full[1] - hi : 0;
  return zoomBetween(full, lo + shift, hi + shift);
}

/** The zoomed range slid (same width) just far enough to show `x`; unchanged when it already does. */
export function panToShow(full: Range, shown: Range, x: number): Range {
  if (x >= shown[0] && x <= shown[1]) return shown;
  const width = shown[1] - shown[0];
  const lo = x < shown[0] ? Math.max(full[0], x) : Math.min(full[1], x) - width;
  const start = Math.min(Math.max(full[0], lo), full[1] - width);
  return [start, start + width];
}

/** What a plot tells the cursor about itself. */
export interface CursorHost {
  /** The whole x range: the data's, or the caller's fixed range. */
  readonly fullDomain: Signal<Range>;
  /** The drawn x scale and where the plot area starts inside the SVG. */
  readonly geometry: () => { readonly x: XScale; readonly left: number; readonly innerWidth: number };
  /** What the cursor snaps to, sorted by x (a series' points), or null to move freely. */
  readonly stops: () => readonly Stop[] | null;
  /** What a screen reader hears with the cursor at x. */
  readonly sentence: (x: number) => string;
  /** An x as the axis writes it, for the zoom announcement. */
  readonly xText: (x: number) => string;
  /** Told when the user moves or hides the cursor. */
  readonly changed?: (x: number | null) => void;
  /** An x another view points at: the cursor shows there while the user's own is hidden. */
  readonly external?: Signal<number | null>;
  /** Where the zoom is kept: the plot's two-way `zoomed` binding, so stacked plots zoom together. */
  readonly zoom?: WritableSignal<Range | null>;
}

/**
 * One zoom for the plots of a page that share an x axis (a time axis, each plot given the same
 * `xDomain` or the same data): bind every plot's two-way `[(zoomed)]` to it and a zoom in one is a
 * zoom in all. It shows the whole range again whenever `data` changes (a new run, answer or sweep),
 * so a zoom never outlives the range it was made on. Create it in a field initialiser.
 */
export function sharedZoom(data: () => unknown): WritableSignal<Range | null> {
  return linkedSignal<unknown, Range | null>({ source: data, computation: () => null });
}

/** The cursor, zoom and table toggle of one plot; create it in the component's field initialisers. */
export class PlotCursor {
  /** The x the user put the cursor on (pointer or keys); null when hidden. */
  readonly x = signal<number | null>(null);
  /** The zoomed x range, null when the whole range is shown. */
  readonly zoom: WritableSignal<Range | null>;
  /** A drag in progress, in px across the plot area. */
  readonly drag = signal<{ readonly from: number; readonly to: number } | null>(null);
  readonly showTable = signal(false);
  readonly announcement = signal('');
  /** The x the cursor shows at: the user's own, else the one another view points at. */
  readonly shownX = computed(() => this.x() ?? this.host.external?.() ?? null);
  /** The x range drawn: the zoom, else the whole range. */
  readonly domain = computed<Range>(() => this.zoom() ?? this.host.fullDomain());
  /** The drag's rectangle (px inside the plot area), for the template. */
  readonly dragBox = computed(() => {
    const d = this.drag();
    return d && Math.abs(d.to - d.from) >= MIN_DRAG_PX ? { x: Math.min(d.from, d.to), width: Math.abs(d.to - d.from) } : null;
  });

  constructor(private readonly host: CursorHost) {
    this.zoom = host.zoom ?? signal<Range | null>(null);
  }

  pointerDown(event: MouseEvent): void {
    if (event.button !== 0) return;
    const px = this.plotPx(event);
    if (px === null) return;
    this.drag.set({ from: px, to: px });
    const target = event.currentTarget;
    if (target instanceof Element && 'pointerId' in event && typeof target.setPointerCapture === 'function') {
      try {
        target.setPointerCapture((event as PointerEvent).pointerId);
      } catch {
        // a synthetic event has no active pointer to capture; the drag still works inside the plot
      }
    }
  }

  pointerMove(event: MouseEvent): void {
    const g = this.host.geometry();
    const raw = this.rawPx(event);
    const d = this.drag();
    if (d) this.drag.set({ from: d.from, to: Math.min(g.innerWidth, Math.max(0, raw)) });
    if (raw < 0 || raw > g.innerWidth) {
      this.set(null);
      return;
    }
    this.set(this.snap(g.x.fromPx(raw)));
  }

  pointerUp(): void {
    const box = this.dragBox();
    this.drag.set(null);
    if (!box) return;
    const x = this.host.geometry().x;
    this.applyZoom(zoomBetween(this.host.fullDomain(), x.fromPx(box.x), x.fromPx(box.x + box.width)));
  }

  leave(): void {
    this.set(null);
  }

  /** Arrows, Home, End and Escape move the cursor; +, − and 0 zoom. Handled keys are not passed on. */
  key(event: KeyboardEvent): void {
    const full = this.host.fullDomain();
    const shown = this.domain();
    const current = this.shownX();
    if (event.key === '+' || event.key === '=' || event.key === '-' || event.key === '_') {
      event.preventDefault();
      const factor = event.key === '+' || event.key === '=' ? 2 : 0.5;
      this.applyZoom(zoomAbout(full, shown, current ?? (shown[0] + shown[1]) / 2, factor));
      return;
    }
    if (event.key === '0') {
      event.preventDefault();
      this.resetZoom();
      return;
    }
    const columns = this.host.geometry().innerWidth;
    const target = cursorKeyTarget(event.key, event.shiftKey, current, { shown, full, columns }, this.host.stops());
    if (target === null) return;
    if (target === 'hide') {
      this.set(null);
      return;
    }
    event.preventDefault();
    const zoom = this.zoom();
    if (zoom) this.zoom.set(panToShow(full, zoom, target));
    this.set(target);
    this.announcement.set(this.host.sentence(target));
  }

  resetZoom(): void {
    this.applyZoom(null);
  }

  toggleTable(): void {
    this.showTable.update((shown) => !shown);
  }

  private applyZoom(range: Range | null): void {
    this.zoom.set(range);
    const [from, to] = this.domain();
    this.announcement.set(range ? `Zoomed to ${this.host.xText(from)} – ${this.host.xText(to)}` : 'Showing the whole range');
  }

  private set(x: number | null): void {
    if (x === this.x()) return;
    this.x.set(x);
    this.host.changed?.(x);
  }

  private snap(x: number): number {
    const stops = this.host.stops();
    if (!stops || stops.length === 0) return x;
    return stops[nearestIndex(stops, x)].x;
  }

  private rawPx(event: MouseEvent): number {
    const target = event.currentTarget;
    const left = target instanceof Element ? target.getBoundingClientRect().left : 0;
    return event.clientX - left - this.host.geometry().left;
  }

  private plotPx(event: MouseEvent): number | null {
    const px = this.rawPx(event);
    return px < 0 || px > this.host.geometry().innerWidth ? null : px;
  }
}
