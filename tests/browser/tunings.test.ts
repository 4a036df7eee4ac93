import type { Page } from 'playwright-core';
import {
  type ConsoleBrowser,
  PHONE,
  contrastProblems,
  horizontalOverflow,
  screenshot,
} from './support/browser';
import { openPage, withSignedInBrowser } from './support/console-pages';
import { type RunningService, startService } from './support/service';

// The tuning page of the demo room: the channel table and editor, the room's limits refused in place,
// saving versions, the difference to the previous one, restore, compare, rename, report and delete.
let service: RunningService;

beforeAll(async () => {
  service = await startService();
});

afterAll(async () => {
  await service?.stop();
});

function withBrowser(
  colorScheme: 'light' | 'dark',
  run: (page: Page, browser: ConsoleBrowser) => Promise<void>,
): Promise<void> {
  return withSignedInBrowser(service.origin, colorScheme, 'dev@kestrel.example', run);
}

async function openTuning(page: Page, name: string): Promise<void> {
  await openPage(page, service.origin, '/rooms', 'Rooms');
  await page.getByRole('link', { name: /Stage 3/ }).click();
  await page.getByRole('heading', { level: 1, name: 'Stage 3' }).waitFor();
  await page.getByRole('link', { name, exact: true }).click();
  await page.getByRole('heading', { level: 1, name }).waitFor();
  await page
    .getByTestId('tuning-channels')
    .getByRole('cell', { name: /M\+000/ })
    .waitFor();
}

const editor = (page: Page) => page.getByTestId('channel-editor');

it('applies a measured channel’s fitted EQ to a chosen tuning as a new version', async () => {
  await withBrowser('light', async (page) => {
    await openPage(page, service.origin, '/rooms', 'Rooms');
    await page.getByRole('link', { name: /Stage 3/ }).click();
    await page.getByRole('heading', { level: 1, name: 'Stage 3' }).waitFor();
    await page.getByRole('button', { name: /Show M\+030 at 2/ }).click();
    await page.getByRole('heading', { name: 'Response of M+030' }).waitFor();
    await page.getByTestId('fit-summary').waitFor();
    const fitted = await page.getByRole('list', { name: 'Fitted EQ bands' }).locator('li').count();
    expect(fitted).toBeGreaterThan(0);
    await page.getByTestId('apply-fit').click();
    const dialog = page.getByRole('dialog');
    await dialog.getByTestId('apply-tuning').click();
    await page.getByRole('option', { name: /Full range \(demo\)/ }).click();
    expect(await dialog.getByTestId('apply-channel').textContent()).toMatch(/M\+030 \(measured\)/);
    await screenshot(page, 'apply-fit-dialog');
    await dialog.getByTestId('apply-confirm').click();
    await page.getByText(/Fitted EQ applied to M\+030 of “Full range \(demo\)”, version 2\./).waitFor();
    await page.getByRole('button', { name: 'Open' }).click();
    await page.getByRole('heading', { level: 1, name: 'Full range (demo)' }).waitFor();
    await page.getByText('Version 2 of 2').waitFor();
    const row = page.getByTestId('tuning-channels').getByRole('row', { name: /M\+030/ });
    expect((await row.getByRole('cell').last().textContent())?.trim()).toBe(String(fitted));
  });
});

it('edits a channel: limits refused as typed, a new version saved, its changes shown and restored', async () => {
  await withBrowser('light', async (page) => {
    await openTuning(page, 'Bass-managed 80 Hz (demo)');
    await page.getByTestId('channel-response').locator('canvas').waitFor();
    // 1.5636 ms at 48 kHz is 75.05 samples: the table shows the whole samples the export uses.
    const left = page.getByTestId('tuning-channels').getByRole('row', { name: /M\+030/ });
    expect(await left.getByRole('cell').nth(2).textContent()).toMatch(/^\s*75\s*$/);
    await screenshot(page, 'tuning');

    await page.getByTestId('pick-M+000').click();
    await page.getByRole('heading', { name: 'M+000' }).waitFor();
    await editor(page).getByText('Room limits: delay up to 75.0 ms').waitFor();
    const before = await editor(page).locator('[data-testid^="eq-band-"]').count();
    await editor(page).getByTestId('add-band').click();
    const band = editor(page).getByTestId(`eq-band-${before}`);
    await band.getByTestId('band-frequencyHz').fill('120');
    await band.getByTestId('band-gainDb').fill('6');
    await band.getByText('The room allows boosts up to +3 dB.').waitFor();
    expect(await editor(page).getByTestId('save-channel').isDisabled()).toBe(true);
    await editor(page).getByTestId('field-trimDb').fill('-13');
    await editor(page).getByText('The room allows trims down to −12 dB.').waitFor();
    await screenshot(page, 'tuning-limits-refused');

    await band.getByTestId('band-gainDb').fill('-4.5');
    await band.getByTestId('band-q').fill('3');
    await editor(page).getByTestId('field-trimDb').fill('-3.3');
    await editor(page).getByTestId('save-channel').click();
    await page.getByText('M+000 saved as version 2.').waitFor();
    await page.getByText('Version 2 of 2').waitFor();
    const v2 = page.getByTestId('versions').getByRole('row', { name: /v2/ });
    await v2.getByText('Edited').waitFor();
    await v2.getByText('You, in the console').waitFor();

    await page.getByTestId('changes-v2').click();
    const diff = page.getByTestId('comparison').getByRole('row', { name: /M\+000/ });
    await diff.getByText(`${before} → ${before + 1} (changed)`).waitFor();
    await screenshot(page, 'tuning-version-changes');

    await page.getByTestId('restore-v1').click();
    await page.getByText('Version 1 restored as version 3.').waitFor();
    await page
      .getByTestId('versions')
      .getByRole('row', { name: /v3/ })
      .getByText('Restored from v1')
      .waitFor();
    await screenshot(page, 'tuning-restored');
    expect(
      await page
        .getByTestId('tuning-channels')
        .getByRole('row', { name: /M\+000/ })
        .getByRole('cell')
        .last()
        .textContent(),
    ).toMatch(new RegExp(`^\\s*${before}\\s*$`));
  });
});

it('shows a past version read-only, compares with another tuning, renames, reports and deletes', async () => {
  await withBrowser('light', async (page) => {
    await openTuning(page, 'Full range (demo)');
    await page.getByTestId('compare-with').click();
    await page.getByRole('option', { name: /Bass-managed 80 Hz \(demo\) · v1/ }).click();
    await page.getByTestId('compare-run').click();
    await page.getByTestId('comparison').getByRole('cell', { name: 'M+030' }).waitFor();
    await screenshot(page, 'tuning-compare');

    await page.getByRole('button', { name: 'More actions' }).click();
    await page.getByTestId('edit-details').click();
    const dialog = page.getByRole('dialog');
    await dialog.getByTestId('tuning-name').fill('   ');
    await dialog.getByTestId('save-details').click();
    await dialog.getByText('Give the tuning a name.').waitFor();
    await dialog.getByTestId('tuning-name').fill('Full range, checked');
    await dialog.getByTestId('tuning-notes').fill('Listened at the desk; no changes.');
    await dialog.getByTestId('save-details').click();
    await page.getByRole('heading', { level: 1, name: 'Full range, checked' }).waitFor();
    await page.getByText('Listened at the desk; no changes.').waitFor();

    await page.getByRole('link', { name: 'Show version 1' }).click();
    await page.getByTestId('past-version').waitFor();
    expect(await editor(page).getByTestId('field-trimDb').isDisabled()).toBe(true);
    expect(await page.getByTestId('tuning-report').getAttribute('href')).toMatch(
      /tuningId=tun_[^&]+&version=1$/,
    );
    await screenshot(page, 'tuning-past-version');

    await page.getByRole('button', { name: 'More actions' }).click();
    await page.getByTestId('delete-tuning').click();
    await page
      .getByRole('dialog')
      .getByText(/All 3 versions of this tuning are deleted/)
      .waitFor();
    await page.getByRole('dialog').getByTestId('confirm-action').click();
    await page.getByRole('heading', { level: 1, name: 'Stage 3' }).waitFor();
    expect(await page.getByRole('link', { name: 'Full range, checked' }).count()).toBe(0);
  });
});

it('edits a channel with the keyboard alone', async () => {
  await withBrowser('light', async (page) => {
    await openTuning(page, 'Bass-managed 80 Hz (demo)');
    await page.getByTestId('pick-M-030').focus();
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'M-030' }).waitFor();
    await editor(page).getByTestId('field-delayMs').focus();
    await page.keyboard.press('Tab');
    expect(await page.evaluate('document.activeElement?.dataset?.testid')).toBe('field-trimDb');
    await page.keyboard.press('Control+A');
    await page.keyboard.type('-2');
    await editor(page).getByTestId('save-channel').focus();
    await page.keyboard.press('Enter');
    await page.getByText(/M-030 saved as version \d+\./).waitFor();
  });
});

it('fits a phone and the dark scheme, with readable contrast', async () => {
  await withBrowser('dark', async (page) => {
    await page.setViewportSize(PHONE);
    await openTuning(page, 'Bass-managed 80 Hz (demo)');
    await page.getByTestId('channel-response').locator('canvas').waitFor();
    expect(await horizontalOverflow(page)).toEqual([]);
    expect(await contrastProblems(page)).toEqual([]);
    await screenshot(page, 'phone-dark-tuning');
  });
  await withBrowser('light', async (page) => {
    await openTuning(page, 'Bass-managed 80 Hz (demo)');
    expect(await contrastProblems(page)).toEqual([]);
  });
});
