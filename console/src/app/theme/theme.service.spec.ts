import { DOCUMENT } from '@angular/common';
import { TestBed } from '@angular/core/testing';
import { ThemeService } from './theme.service';

describe('ThemeService', () => {
  let prefersDark = false;
  const listeners: Array<() => void> = [];
  // Spec files share one module graph per worker: the stub must not outlive this file, or a later
  // component's breakpoint observer meets a media query list without the older listener methods.
  const originalMatchMedia = window.matchMedia;
  afterEach(() => {
    window.matchMedia = originalMatchMedia;
  });

  beforeEach(() => {
    localStorage.clear();
    listeners.length = 0;
    prefersDark = false;
    window.matchMedia = ((query: string) => ({
      get matches() {
        return query.includes('dark') && prefersDark;
      },
      media: query,
      addEventListener: (_: string, listener: () => void) => listeners.push(listener),
      removeEventListener: () => undefined,
      addListener: (listener: () => void) => listeners.push(listener),
      removeListener: () => undefined,
    })) as unknown as typeof window.matchMedia;
    document.documentElement.className = '';
  });

  function create(): ThemeService {
    const theme = TestBed.inject(ThemeService);
    TestBed.tick();
    return theme;
  }

  it('follows the system by default and stores nothing', () => {
    const theme = create();
    expect(theme.mode()).toBe('system');
    expect(theme.isDark()).toBe(false);
    prefersDark = true;
    listeners.forEach((listener) => listener());
    expect(theme.isDark()).toBe(true);
    expect(localStorage.getItem('isochron.theme')).toBeNull();
  });

  it('applies and remembers an explicit choice, and forgets it when back to system', () => {
    const theme = create();
    const root = TestBed.inject(DOCUMENT).documentElement;
    const before = theme.revision();

    theme.mode.set('dark');
    TestBed.tick();
    expect(root.classList.contains('iso-dark')).toBe(true);
    expect(root.classList.contains('iso-light')).toBe(false);
    expect(localStorage.getItem('isochron.theme')).toBe('dark');
    expect(theme.isDark()).toBe(true);
    expect(theme.revision()).toBeGreaterThan(before);

    theme.mode.set('light');
    TestBed.tick();
    expect(root.classList.contains('iso-light')).toBe(true);
    expect(root.classList.contains('iso-dark')).toBe(false);
    expect(theme.isDark()).toBe(false);

    theme.mode.set('system');
    TestBed.tick();
    expect(root.classList.contains('iso-light')).toBe(false);
    expect(localStorage.getItem('isochron.theme')).toBeNull();
  });

  it('starts from a stored choice and ignores a stored value it does not know', () => {
    localStorage.setItem('isochron.theme', 'light');
    expect(create().mode()).toBe('light');
    TestBed.resetTestingModule();
    localStorage.setItem('isochron.theme', 'sepia');
    expect(create().mode()).toBe('system');
  });
});
