import { DOCUMENT, Injectable, computed, inject, signal } from '@angular/core';

export type ColorScheme = 'light' | 'dark';

const STORAGE_KEY = 'eclipta.theme';

function storedScheme(): ColorScheme | null {
  try {
    const value = localStorage.getItem(STORAGE_KEY);
    return value === 'light' || value === 'dark' ? value : null;
  } catch {
    return null;
  }
}

/**
 * Light or dark: the user's explicit choice when they made one, otherwise the system's
 * (prefers-color-scheme), which the stylesheet follows on its own through color-scheme.
 */
@Injectable({ providedIn: 'root' })
export class ThemePreference {
  private readonly document = inject(DOCUMENT);
  private readonly chosen = signal<ColorScheme | null>(storedScheme());
  private readonly systemDark = signal(this.document.defaultView?.matchMedia?.('(prefers-color-scheme: dark)').matches ?? false);

  readonly scheme = computed<ColorScheme>(() => this.chosen() ?? (this.systemDark() ? 'dark' : 'light'));

  /** Puts the choice on <html> and keeps following the system while the user has not chosen. */
  apply(): void {
    this.document.defaultView
      ?.matchMedia?.('(prefers-color-scheme: dark)')
      .addEventListener('change', (event) => this.systemDark.set(event.matches));
    this.paint();
  }

  toggle(): void {
    const next: ColorScheme = this.scheme() === 'dark' ? 'light' : 'dark';
    this.chosen.set(next);
    try {
      localStorage.setItem(STORAGE_KEY, next);
    } catch {
      // kept for this visit only
    }
    this.paint();
  }

  private paint(): void {
    const root = this.document.documentElement;
    const chosen = this.chosen();
    root.classList.toggle('ecl-light', chosen === 'light');
    root.classList.toggle('ecl-dark', chosen === 'dark');
  }
}
