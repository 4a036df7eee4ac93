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
): Promise<ConsoleBrowser> {
  const profile = mkdtempSync(path.join(tmpdir(), 'isochron-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: CHROMIUM_ARGS,
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
