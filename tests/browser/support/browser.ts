import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { type BrowserContext, type Page, chromium } from 'playwright-core';

const root = path.resolve(__dirname, '../../..');
export const SCREENSHOT_DIR = path.join(root, 'test-artifacts/screenshots');

/** Flags for Debian's Chromium in a container: no sandbox, no GPU, and nothing that phones home. */
const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-quic',
  '--no-first-run',
  '--disable-sync',
];

export const DESKTOP = { width: 1366, height: 900 };
export const PHONE = { width: 390, height: 844 };

interface AllowedFailure {
  path: string;
  status: number;
}

export interface ConsoleBrowser {
  context: BrowserContext;
  newPage: (viewport?: { width: number; height: number }) => Promise<Page>;
  /** A failing request the test provokes on purpose; the browser logs it and that is not a fault. */
  allowFailure: (path: string, status: number) => void;
  /** Console errors, page errors and requests that tried to leave the machine, so far. */
  faults: () => string[];
  close: () => Promise<void>;
}

/**
 * Chromium with a fresh profile. Every request to anything but the service's origin is aborted and
 * recorded, and every console error or uncaught page error is recorded, so a test can fail on them.
 */
export async function launchBrowser(
  origin: string,
  colorScheme: 'light' | 'dark' = 'light',
  /** More Chromium flags, e.g. the fake capture device of the capture test. */
  extraArgs: readonly string[] = [],
): Promise<ConsoleBrowser> {
  const profile = mkdtempSync(path.join(tmpdir(), 'isochron-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: [...CHROMIUM_ARGS, ...extraArgs],
    viewport: DESKTOP,
    colorScheme,
    acceptDownloads: true,
    permissions: ['clipboard-read', 'clipboard-write'],
  });
  const faults: string[] = [];
  const allowed: AllowedFailure[] = [];

  await context.route('**/*', async (route) => {
    const url = route.request().url();
    if (url.startsWith(`${origin}/`) || url === origin) return route.continue();
    faults.push(`request left the machine: ${route.request().method()} ${url}`);
    return route.abort('blockedbyclient');
  });
  context.on('console', (message) => {
    if (message.type() !== 'error') return;
    const url = message.location().url ?? '';
    const status = Number(/status of (\d{3})/.exec(message.text())?.[1]);
    const expected = allowed.some(
      (entry) => url.startsWith(`${origin}${entry.path}`) && entry.status === status,
    );
    if (!expected) faults.push(`console error: ${message.text()} (${url})`);
  });
  context.on('weberror', (error) => faults.push(`page error: ${error.error().message}`));

  return {
    context,
    newPage: async (viewport = DESKTOP) => {
      const page = await context.newPage();
      await page.setViewportSize(viewport);
      return page;
    },
    allowFailure: (failurePath, status) => allowed.push({ path: failurePath, status }),
    faults: () => [...faults],
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * A screenshot of the whole page under test-artifacts/screenshots/, for people to look at. The viewport
 * is stretched to the page's height for the shot, so the sticky toolbar and the fixed navigation are
 * drawn where a person sees them rather than smeared across a scrolled capture.
 */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const viewport = page.viewportSize() ?? DESKTOP;
  await page.evaluate('window.scrollTo(0, 0)');
  const height = (await page.evaluate('document.documentElement.scrollHeight')) as number;
  await page.setViewportSize({
    width: viewport.width,
    height: Math.max(viewport.height, Math.min(height, 6000)),
  });
  await page.waitForTimeout(150);
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), animations: 'disabled' });
  await page.setViewportSize(viewport);
}

/**
 * In-page check (plain JavaScript, passed as text so no bundler helper leaks into the page): every
 * scroll container wider than its box other than the ones meant to scroll (wide tables, code blocks,
 * tab headers), and anything reaching past the viewport that no ancestor clips.
 */
const OVERFLOW_CHECK = `(() => {
  const allowedScrollers = '.iso-table-scroll, pre, textarea, .mat-mdc-tab-header, .mat-mdc-tab-label-container';
  const problems = [];
  function describe(element) {
    const classes = element.classList.length ? '.' + Array.from(element.classList).slice(0, 3).join('.') : '';
    return element.tagName.toLowerCase() + (element.id ? '#' + element.id : '') + classes;
  }
  const viewport = document.documentElement.clientWidth;
  if (document.documentElement.scrollWidth > viewport + 1) {
    problems.push('document is ' + document.documentElement.scrollWidth + 'px wide in a ' + viewport + 'px viewport');
  }
  for (const element of document.querySelectorAll('body *')) {
    const style = getComputedStyle(element);
    if (style.display === 'none' || style.visibility === 'hidden') continue;
    const scrolls = style.overflowX === 'auto' || style.overflowX === 'scroll';
    if (scrolls && element.scrollWidth > element.clientWidth + 1 && !element.matches(allowedScrollers)) {
      problems.push(describe(element) + ' scrolls sideways (' + element.scrollWidth + ' > ' + element.clientWidth + ')');
    }
    const rect = element.getBoundingClientRect();
    if (rect.width === 0 || rect.right <= viewport + 1) continue;
    let clipped = false;
    for (let parent = element.parentElement; parent; parent = parent.parentElement) {
      const overflow = getComputedStyle(parent).overflowX;
      if (['auto', 'scroll', 'hidden', 'clip'].includes(overflow) && parent.getBoundingClientRect().right <= viewport + 1) {
        clipped = true;
        break;
      }
    }
    if (!clipped && !element.closest('.cdk-overlay-container')) {
      problems.push(describe(element) + ' reaches ' + Math.round(rect.right) + 'px in a ' + viewport + 'px viewport');
    }
  }
  return Array.from(new Set(problems)).slice(0, 20);
})()`;

/** What makes the page scroll sideways at the current viewport; empty when nothing does. */
export async function horizontalOverflow(page: Page): Promise<string[]> {
  return page.evaluate(OVERFLOW_CHECK);
}

/**
 * In-page WCAG 2.1 contrast check (success criterion 1.4.3): every visible element with its own text,
 * against the background it sits on (semi-transparent layers composed over their parents), must reach
 * 4.5:1, or 3:1 for large text (24 px, or 18.66 px bold). Disabled controls are exempt, as WCAG says.
 * Relative luminance and the ratio follow the WCAG 2.1 definitions.
 */
const CONTRAST_CHECK = `(() => {
  function parse(colour) {
    const m = colour.match(/rgba?\\(([^)]+)\\)/);
    if (!m) return null;
    const parts = m[1].split(/[ ,\\/]+/).filter(Boolean).map(Number);
    return { r: parts[0], g: parts[1], b: parts[2], a: parts.length > 3 ? parts[3] : 1 };
  }
  function over(top, bottom) {
    const a = top.a + bottom.a * (1 - top.a);
    if (a === 0) return { r: 0, g: 0, b: 0, a: 0 };
    const mix = (t, b) => (t * top.a + b * bottom.a * (1 - top.a)) / a;
    return { r: mix(top.r, bottom.r), g: mix(top.g, bottom.g), b: mix(top.b, bottom.b), a };
  }
  function background(element) {
    const layers = [];
    for (let node = element; node; node = node.parentElement) {
      const colour = parse(getComputedStyle(node).backgroundColor);
      if (colour && colour.a > 0) {
        layers.push(colour);
        if (colour.a >= 1) break;
      }
    }
    let result = { r: 255, g: 255, b: 255, a: 1 };
    if (layers.length && layers[layers.length - 1].a >= 1) result = layers.pop();
    while (layers.length) result = over(layers.pop(), result);
    return result;
  }
  function luminance(c) {
    const channel = (v) => { v /= 255; return v <= 0.03928 ? v / 12.92 : Math.pow((v + 0.055) / 1.055, 2.4); };
    return 0.2126 * channel(c.r) + 0.7152 * channel(c.g) + 0.0722 * channel(c.b);
  }
  const problems = [];
  for (const element of document.querySelectorAll('body *')) {
    const ownText = Array.from(element.childNodes).some((n) => n.nodeType === 3 && n.textContent.trim());
    if (!ownText) continue;
    const style = getComputedStyle(element);
    const rect = element.getBoundingClientRect();
    if (style.visibility === 'hidden' || style.display === 'none' || rect.width === 0 || rect.height === 0) continue;
    if (element.closest('[disabled], [aria-disabled="true"], .mat-mdc-button-disabled, .iso-visually-hidden, .cdk-visually-hidden, canvas')) continue;
    if (parseFloat(style.opacity) === 0) continue;
    const fg = parse(style.color);
    if (!fg) continue;
    const bg = background(element);
    const text = over(fg, bg);
    const l1 = luminance(text), l2 = luminance(bg);
    const ratio = (Math.max(l1, l2) + 0.05) / (Math.min(l1, l2) + 0.05);
    const size = parseFloat(style.fontSize);
    const large = size >= 24 || (size >= 18.66 && Number(style.fontWeight) >= 700);
    const needed = large ? 3 : 4.5;
    if (ratio < needed) {
      problems.push(element.tagName.toLowerCase() + '.' + Array.from(element.classList).slice(0, 2).join('.') + ' "' +
        element.textContent.trim().slice(0, 30) + '" ' + ratio.toFixed(2) + ':1 < ' + needed);
    }
  }
  return Array.from(new Set(problems)).slice(0, 20);
})()`;

/** Text that misses the WCAG AA contrast ratio on the current page; empty when all text passes. */
export async function contrastProblems(page: Page): Promise<string[]> {
  return page.evaluate(CONTRAST_CHECK);
}
