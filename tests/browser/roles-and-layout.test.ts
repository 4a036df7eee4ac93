import type { Page } from 'playwright-core';
import {
  type ConsoleBrowser,
  PHONE,
  contrastProblems,
  horizontalOverflow,
  launchBrowser,
  screenshot,
} from './support/browser';
import { ADMIN_PAGES, openPage, signIn } from './support/console-pages';
import { type RunningService, startService } from './support/service';

// What each role sees, and whether every page holds together on a 390 px phone and in the dark scheme.
let service: RunningService;

beforeAll(async () => {
  service = await startService();
});

afterAll(async () => {
  await service?.stop();
});

async function withBrowser(
  colorScheme: 'light' | 'dark',
  run: (browser: ConsoleBrowser, page: Page) => Promise<void>,
): Promise<void> {
  const browser = await launchBrowser(service.origin, colorScheme);
  browser.allowFailure('/auth/session', 401);
  try {
    await run(browser, await browser.newPage());
    expect(browser.faults()).toEqual([]);
  } finally {
    await browser.close();
  }
}

describe('the demo viewer', () => {
  it('finds no create, revoke or invite controls and cannot open admin pages', async () => {
    await withBrowser('light', async (_browser, page) => {
      await signIn(page, service.origin, 'viewer@kestrel.example');
      const nav = page.getByRole('navigation', { name: 'Main' });
      expect(await nav.getByRole('link').allTextContents()).toEqual([
        expect.stringContaining('Overview'),
        expect.stringContaining('Usage'),
        expect.stringContaining('Playground'),
        expect.stringContaining('API reference'),
      ]);
      await page.getByTestId('cautions').waitFor();
      expect(await page.getByRole('link', { name: /Create an API key|Invite a colleague/ }).count()).toBe(0);
      await screenshot(page, 'overview-viewer');

      // A link to a page the role may not open says so at that address instead of jumping elsewhere.
      for (const [path, needs] of [
        ['/keys', /may hold API keys: the Developer or Admin role\. You are signed in as Viewer/],
        ['/users', /may manage users: the Admin role/],
        ['/rooms', /may work with rooms, measurements and tunings/],
      ] as const) {
        await page.goto(`${service.origin}${path}`);
        await page.getByRole('heading', { level: 1, name: 'This page needs another role' }).waitFor();
        expect(await page.getByTestId('needs-permission').textContent()).toMatch(needs);
        expect(page.url()).toBe(`${service.origin}${path}`);
      }
      await screenshot(page, 'viewer-needs-role');
      for (const testId of ['create-key', 'revoke-key', 'invite-user']) {
        expect(await page.getByTestId(testId).count()).toBe(0);
      }

      await openPage(page, service.origin, '/usage', 'Usage');
      await page.getByTestId('download-csv').waitFor();
      await screenshot(page, 'usage-viewer');

      await openPage(page, service.origin, '/playground', 'Playground');
      expect(await page.getByTestId('playground-key').count()).toBe(1);
      // Not a dead end: the page says what a viewer can do here, and does not offer the session it may not use.
      await page
        .getByText('Paste an API key: your role cannot send this with the console session.')
        .waitFor();
      expect(await page.getByTestId('playground-role-note').textContent()).toMatch(
        /What you can do here as Viewer.*a Developer or Admin gives you/s,
      );
      expect(
        await page.getByRole('radio', { name: /My console session \(not for Viewer\)/ }).isDisabled(),
      ).toBe(true);
      await openPage(page, service.origin, '/playground', 'Playground');
      await screenshot(page, 'playground-viewer');
    });
  });
});

describe('the keyboard', () => {
  it('signs in, skips to the content and moves through the navigation without a mouse', async () => {
    await withBrowser('light', async (_browser, page) => {
      await page.goto(`${service.origin}/sign-in`);
      await page.getByLabel('E-mail').focus();
      await page.keyboard.type('admin@kestrel.example');
      await page.keyboard.press('Tab');
      await page.keyboard.type('kestrel-demo');
      await page.keyboard.press('Enter');
      await page.waitForURL(`${service.origin}/`);
      await page.getByRole('heading', { name: 'Overview' }).waitFor();
      await page.keyboard.press('Tab');
      expect(await page.evaluate('document.activeElement?.textContent?.trim()')).toBe('Skip to content');
      await page.keyboard.press('Enter');
      expect(await page.evaluate('document.activeElement?.id')).toBe('main-content');
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: /Usage/ }).focus();
      await page.keyboard.press('Enter');
      await page.waitForURL(`${service.origin}/usage`);
      await page.getByRole('heading', { level: 1, name: 'Usage' }).waitFor();
      // The skip link works on every page, not only on the overview.
      await page.getByText('Skip to content').focus();
      await page.keyboard.press('Enter');
      expect(page.url()).toBe(`${service.origin}/usage`);
      expect(await page.evaluate('document.activeElement?.id')).toBe('main-content');
      expect(
        await page
          .getByRole('navigation', { name: 'Main' })
          .getByRole('link', { name: /Usage/ })
          .getAttribute('aria-current'),
      ).toBe('page');
    });
  });
});

describe('the demo developer', () => {
  it('manages own keys but sees neither users nor other owners', async () => {
    await withBrowser('light', async (_browser, page) => {
      await signIn(page, service.origin, 'dev@kestrel.example');
      await openPage(page, service.origin, '/keys', 'API keys');
      await page.getByTestId('create-key').waitFor();
      await page.getByRole('row', { name: /Sweep rig/ }).waitFor();
      expect(await page.locator('.key-owner').count()).toBe(0);
      expect(await page.getByRole('link', { name: /Users/ }).count()).toBe(0);
      await page.getByTestId('create-key').click();
      await page.getByRole('dialog').getByTestId('key-role').click();
      expect(await page.getByRole('option').allTextContents()).toEqual([
        expect.stringContaining('Calculate'),
        expect.stringContaining('Tuning'),
      ]);
      await page.keyboard.press('Escape');
      await screenshot(page, 'keys-developer-create');
    });
  });
});

describe('on a 390 px phone', () => {
  it('shows every admin page without sideways scrolling', async () => {
    await withBrowser('light', async (_browser, page) => {
      await signIn(page, service.origin, 'admin@kestrel.example');
      await page.setViewportSize(PHONE);
      const overflowing: Record<string, string[]> = {};
      for (const { path, heading, name } of ADMIN_PAGES) {
        await openPage(page, service.origin, path, heading);
        const problems = await horizontalOverflow(page);
        if (problems.length) overflowing[path] = problems;
        await screenshot(page, `phone-${name}`);
      }
      expect(overflowing).toEqual({});

      await page.getByRole('button', { name: 'Open navigation' }).click();
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: /Usage/ }).waitFor();
      await screenshot(page, 'phone-navigation');
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: /Usage/ }).click();
      await page.waitForURL(`${service.origin}/usage`);

      await openPage(page, service.origin, '/playground?op=designCrossover', 'Playground');
      await page.getByTestId('send-request').click();
      await page.getByTestId('response-plot').waitFor();
      expect(await horizontalOverflow(page)).toEqual([]);
      await screenshot(page, 'phone-playground-crossover');
    });
  });

  it('shows the sign-in and invitation pages without sideways scrolling', async () => {
    await withBrowser('light', async (_browser, page) => {
      await page.setViewportSize(PHONE);
      await page.goto(`${service.origin}/sign-in`);
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
      expect(await horizontalOverflow(page)).toEqual([]);
      await screenshot(page, 'phone-sign-in');
      await page.goto(`${service.origin}/accept-invitation`);
      await page.getByText('This link has no invitation token.').waitFor();
      expect(await horizontalOverflow(page)).toEqual([]);
      await screenshot(page, 'phone-accept-invitation-without-token');
    });
  });
});

describe('in the dark scheme', () => {
  it('draws the pages and the filter plot with the dark palette', async () => {
    await withBrowser('dark', async (_browser, page) => {
      await signIn(page, service.origin, 'admin@kestrel.example');
      const background = await page.evaluate('getComputedStyle(document.body).backgroundColor');
      const [r, g, b] = String(background).match(/\d+/g)!.map(Number);
      expect(r + g + b).toBeLessThan(3 * 60);
      await openPage(page, service.origin, '/', 'Overview');
      await screenshot(page, 'dark-overview');
      await openPage(page, service.origin, '/playground?op=planBassManagement', 'Playground');
      await page.getByTestId('send-request').click();
      await page.getByTestId('response-plot').waitFor();
      await page.waitForTimeout(300);
      await screenshot(page, 'dark-playground-bass-management');
      await openPage(page, service.origin, '/keys', 'API keys');
      await screenshot(page, 'dark-keys');
    });
  });

  it('lets the person pick a scheme that outlives a reload', async () => {
    await withBrowser('light', async (_browser, page) => {
      await signIn(page, service.origin, 'admin@kestrel.example');
      await page.getByRole('button', { name: 'Colour scheme' }).click();
      await page.getByRole('menuitem', { name: 'Dark' }).click();
      await page.reload();
      await page.getByRole('heading', { name: 'Overview' }).waitFor();
      expect(await page.evaluate('document.documentElement.classList.contains("iso-dark")')).toBe(true);
    });
  });
});

describe('readable contrast', () => {
  it.each(['light', 'dark'] as const)(
    'keeps every text at WCAG AA contrast in the %s scheme',
    async (scheme) => {
      await withBrowser(scheme, async (_browser, page) => {
        await page.goto(`${service.origin}/sign-in`);
        await page.getByRole('button', { name: 'Sign in' }).waitFor();
        // The check itself must catch a grey-on-grey line before its silence means anything.
        await page.evaluate(
          "document.body.insertAdjacentHTML('beforeend', '<p id=\\'probe\\' style=\\'color:#999;background:#aaa\\'>probe</p>')",
        );
        expect((await contrastProblems(page)).some((problem) => problem.includes('"probe"'))).toBe(true);
        await page.evaluate("document.getElementById('probe').remove()");
        const failing: Record<string, string[]> = {};
        const signInProblems = await contrastProblems(page);
        if (signInProblems.length) failing['/sign-in'] = signInProblems;
        await signIn(page, service.origin, 'admin@kestrel.example');
        for (const { path, heading } of ADMIN_PAGES) {
          await openPage(page, service.origin, path, heading);
          const problems = await contrastProblems(page);
          if (problems.length) failing[path] = problems;
        }
        expect(failing).toEqual({});
      });
    },
  );
});
