import { DOCUMENT } from '@angular/common';
import { Injectable, effect, inject, signal } from '@angular/core';

/** The person's choice of colour scheme; `system` follows the operating system. */
export type ThemeMode = 'system' | 'light' | 'dark';

const STORAGE_KEY = 'isochron.theme';

function readStoredMode(): ThemeMode {
  try {
    const stored = localStorage.getItem(STORAGE_KEY);
    return stored === 'light' || stored === 'dark' ? stored : 'system';
  } catch {
    return 'system';
  }
}

/** Applies the chosen scheme as a class on <html>; the theme's light-dark() values follow it. */
@Injectable({ providedIn: 'root' })
export class ThemeService {
  private readonly document = inject(DOCUMENT);
  readonly mode = signal<ThemeMode>(readStoredMode());
  /** Bumped whenever the resolved colours may have changed, so canvases can repaint. */
  readonly revision = signal(0);

  constructor() {
    const media = this.document.defaultView?.matchMedia?.('(prefers-color-scheme: dark)');
    media?.addEventListener('change', () => this.revision.update((value) => value + 1));
    effect(() => {
      const mode = this.mode();
      const root = this.document.documentElement;
      root.classList.toggle('iso-light', mode === 'light');
      root.classList.toggle('iso-dark', mode === 'dark');
      try {
        if (mode === 'system') localStorage.removeItem(STORAGE_KEY);
        else localStorage.setItem(STORAGE_KEY, mode);
      } catch {
        // Private windows may refuse storage; the choice then lasts for this page only.
      }
      this.revision.update((value) => value + 1);
    });
  }

  isDark(): boolean {
    this.revision();
    const mode = this.mode();
    if (mode !== 'system') return mode === 'dark';
    return this.document.defaultView?.matchMedia?.('(prefers-color-scheme: dark)').matches ?? false;
  }
}
