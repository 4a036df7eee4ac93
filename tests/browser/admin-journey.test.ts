import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { type ConsoleBrowser, launchBrowser, screenshot } from './support/browser';
import { openPage } from './support/console-pages';
import { plainRequest } from './support/http';
import { type RunningService, startService } from './support/service';

// The admin's day in the console, end to end against the built service: sign in, create a key and see
// its secret exactly once, use it in the playground to design a biquad and see the plot, revoke it and
// watch the API refuse it, read usage and download it, invite a colleague who then sets a password.
let service: RunningService;
let browser: ConsoleBrowser;
let page: Page;
let secret = '';
const KEY_NAME = 'Browser check — Stage 3 rig';

beforeAll(async () => {
  service = await startService();
  browser = await launchBrowser(service.origin);
  // Loading the console while signed out asks "who am I?" and is told 401: expected, not a fault.
  browser.allowFailure('/auth/session', 401);
  page = await browser.newPage();
});

afterAll(async () => {
  await browser?.close();
  await service?.stop();
});

afterEach(() => {
  if (browser) expect(browser.faults()).toEqual([]);
});

it('shows the sign-in page to a visitor and refuses a wrong password with a readable message', async () => {
  await page.goto(`${service.origin}/keys`);
  await page.waitForURL(/\/sign-in\?next=%2Fkeys/);
  await screenshot(page, 'sign-in');
  await page.getByLabel('E-mail').fill('admin@kestrel.example');
  await page.getByLabel('Password', { exact: true }).fill('not the password');
  browser.allowFailure('/auth/session', 401);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('alert').filter({ hasText: 'The e-mail address or the password is wrong.' }).waitFor();
  await screenshot(page, 'sign-in-refused');
});

it('signs the demo admin in and returns to the page that was asked for', async () => {
  await page.getByLabel('Password', { exact: true }).fill('kestrel-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${service.origin}/keys`);
  await page.getByRole('heading', { level: 1, name: 'API keys' }).waitFor();
  await openPage(page, service.origin, '/', 'Overview');
  await page.getByTestId('cautions').waitFor();
  await screenshot(page, 'overview-admin');
});

it('creates a key and shows its secret once, with a copy button and a clear warning', async () => {
  await openPage(page, service.origin, '/keys', 'API keys');
  await page.getByTestId('create-key').click();
  const dialog = page.getByRole('dialog');
  await dialog.getByTestId('key-name').fill(KEY_NAME);
  await screenshot(page, 'keys-create-dialog');
  await dialog.getByTestId('submit-create').click();
  const secretField = dialog.getByTestId('new-key-secret');
  await secretField.waitFor();
  secret = await secretField.inputValue();
  expect(secret).toMatch(/^iso_live_[A-Za-z0-9_-]{40,}$/);
  await dialog.getByText('You will not see it again.').waitFor();
  await dialog.getByTestId('copy-secret').click();
  await dialog.getByRole('button', { name: /Copied/ }).waitFor();
  // Closing is held back until the person says the key is stored; Escape does not dismiss it either.
  expect(await dialog.getByTestId('finish-create').isDisabled()).toBe(true);
  await page.keyboard.press('Escape');
  await page.waitForTimeout(300);
  expect(await secretField.isVisible()).toBe(true);
  await screenshot(page, 'keys-secret-once');
  await dialog.getByTestId('stored-check').click();
  await dialog.getByTestId('finish-create').click();
  await dialog.waitFor({ state: 'detached' });
  await page.getByRole('row', { name: new RegExp(KEY_NAME) }).waitFor();
});

it('never shows the secret again, not even after a reload', async () => {
  expect(await page.content()).not.toContain(secret);
  await page.reload();
  await page.getByRole('heading', { level: 1, name: 'API keys' }).waitFor();
  const row = page.getByRole('row', { name: new RegExp(KEY_NAME) });
  await row.waitFor();
  expect(await row.textContent()).toContain(`…${secret.slice(-4)}`);
  expect(await page.content()).not.toContain(secret);
  expect(
    await page.evaluate('JSON.stringify({ ...localStorage }) + JSON.stringify({ ...sessionStorage })'),
  ).not.toContain(secret.slice(9));
  await screenshot(page, 'keys');
});

it('renames a key and sets its rate limit', async () => {
  const row = page.getByRole('row', { name: new RegExp(KEY_NAME) });
  await row.getByRole('button', { name: `Edit ${KEY_NAME}` }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByTestId('edit-key-name').fill(`${KEY_NAME} (night)`);
  await dialog.getByTestId('edit-rate-limit').fill('90');
  await dialog.getByRole('button', { name: 'Save' }).click();
  await dialog.waitFor({ state: 'detached' });
  const renamed = page.getByRole('row', { name: new RegExp(`${KEY_NAME} \\(night\\)`) });
  await renamed.getByText('90 / min').waitFor();
  await page.reload();
  await renamed.getByText('90 / min').waitFor();
});

it('designs a biquad in the playground with the new key and plots its response', async () => {
  await openPage(page, service.origin, '/playground?op=designBiquads', 'Playground');
  await page.getByTestId('auth-key').click();
  await page.getByTestId('playground-key').fill(secret);
  await page.getByTestId('send-request').click();
  await page.getByTestId('response-status').filter({ hasText: '200' }).waitFor();
  const plot = page.getByTestId('response-plot');
  await plot.locator('canvas').first().waitFor();
  expect(await plot.locator('canvas').first().getAttribute('aria-label')).toMatch(
    /Magnitude response on a logarithmic frequency axis/,
  );
  const snippet = await page.getByTestId('snippet-curl').textContent();
  expect(snippet).toContain('$ISOCHRON_KEY');
  expect(snippet).not.toContain(secret);
  await screenshot(page, 'playground-biquad-plot');
});

it('checks the edited body against the schema before sending', async () => {
  const editor = page.getByTestId('body-editor');
  const original = await editor.inputValue();
  await editor.fill(original.replace('"sampleRateHz": 48000', '"sampleRateHz": 1000'));
  const problems = page.getByTestId('schema-problems');
  await problems.waitFor();
  expect(await problems.textContent()).toContain('/sampleRateHz');
  await editor.fill(original.replace('"sampleRateHz": 48000,', '"sampleRateHz": 48000,,'));
  await page
    .getByText(/Line \d+, column \d+/)
    .first()
    .waitFor();
  expect(await page.getByTestId('send-request').isDisabled()).toBe(true);
  await screenshot(page, 'playground-validation');
  await editor.fill(original);
  await page.getByText('Matches the schema.').waitFor();
});

it('revokes the key after confirmation, and the API refuses it from then on', async () => {
  await openPage(page, service.origin, '/keys', 'API keys');
  const row = page.getByRole('row', { name: new RegExp(KEY_NAME) });
  await row.getByTestId('revoke-key').click();
  await page.getByRole('dialog').getByText('This cannot be undone').waitFor();
  await screenshot(page, 'keys-revoke-confirm');
  await page.getByTestId('confirm-action').click();
  await row.getByText('Revoked').waitFor();

  const answer = await plainRequest(`${service.origin}/v1/biquads`, {
    method: 'POST',
    headers: { Authorization: `Bearer ${secret}`, 'Content-Type': 'application/json' },
    body: JSON.stringify({
      sampleRateHz: 48000,
      filters: [{ type: 'peaking', frequencyHz: 63, gainDb: -3, q: 4 }],
    }),
  });
  expect(answer.status).toBe(401);
  expect(answer.headers['content-type']).toMatch(/application\/problem\+json/);

  browser.allowFailure('/v1/biquads', 401);
  await openPage(page, service.origin, '/playground?op=designBiquads', 'Playground');
  await page.getByTestId('auth-key').click();
  await page.getByTestId('playground-key').fill(secret);
  await page.getByTestId('send-request').click();
  await page.getByTestId('response-status').filter({ hasText: '401' }).waitFor();
  await screenshot(page, 'playground-revoked-key');
});

it('shows usage with charts, the limits in force and a table, and downloads it as CSV', async () => {
  // The service writes metered calls every 200 ms in this run; give the meter a moment.
  await page.waitForTimeout(600);
  await openPage(page, service.origin, '/usage', 'Usage');
  const total = Number((await page.getByTestId('usage-total').textContent())?.replace(/\D/g, ''));
  expect(total).toBeGreaterThan(0);
  await page
    .getByRole('cell', { name: /POST \/v1\/biquads/ })
    .first()
    .waitFor();
  // The limits in force, as GET /v1/usage reports them (the service's defaults in this run).
  expect(await page.getByTestId('usage-limits').textContent()).toMatch(
    /600 requests a minute per key.*1,?\s?200 a minute for all keys.*at most 10 active keys per user/s,
  );
  await screenshot(page, 'usage');
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByTestId('download-csv').click(),
  ]);
  expect(download.suggestedFilename()).toMatch(
    /^isochron-usage-\d{4}-\d{2}-\d{2}-to-\d{4}-\d{2}-\d{2}\.csv$/,
  );
  const csv = readFileSync((await download.path()) as string, 'utf8');
  expect(csv.split('\n')[0].trim()).toBe('bucket,keyId,keyName,userId,route,count,errorCount');
  expect(csv).toContain('POST /v1/biquads');
});

it('invites a colleague, shows the e-mail in the outbox, and the link lets them set a password', async () => {
  await openPage(page, service.origin, '/users', 'Users');
  await page.getByTestId('invite-user').click();
  const dialog = page.getByRole('dialog');
  await dialog.getByTestId('invite-email').fill('mix.engineer@kestrel.example');
  await dialog.getByTestId('send-invite').click();
  await dialog.waitFor({ state: 'detached' });
  await page
    .getByRole('row', { name: /mix\.engineer@kestrel\.example/ })
    .getByText('Invited')
    .waitFor();
  const message = page.getByTestId('outbox-message').first();
  await message.waitFor();
  await message.click();
  const link = message.getByRole('link', { name: /accept-invitation\?token=/ });
  await link.waitFor();
  await screenshot(page, 'users-outbox');
  const firstHref = (await link.textContent()) ?? '';
  expect(firstHref.startsWith(`${service.origin}/accept-invitation?token=`)).toBe(true);

  // The first e-mail went astray: a new link, after a confirmation, replaces it.
  const row = page.getByRole('row', { name: /mix\.engineer@kestrel\.example/ });
  await row.getByRole('button', { name: 'Send mix.engineer@kestrel.example a new invitation link' }).click();
  const confirm = page.getByRole('dialog');
  await confirm.getByText('The link sent before stops working').waitFor();
  await confirm.getByRole('button', { name: 'Send new link' }).click();
  await page.getByText(/A new invitation sent to mix\.engineer@kestrel\.example, valid until/).waitFor();
  await page.getByTestId('outbox-message').nth(1).waitFor();
  const newest = page.getByTestId('outbox-message').first();
  await newest.click();
  const newLink = newest.getByRole('link', { name: /accept-invitation\?token=/ });
  await newLink.waitFor();
  await screenshot(page, 'users-new-link');
  const href = (await newLink.textContent()) ?? '';
  expect(href.startsWith(`${service.origin}/accept-invitation?token=`)).toBe(true);
  expect(href).not.toBe(firstHref);

  const newcomer = await launchBrowser(service.origin);
  try {
    newcomer.allowFailure('/auth/session', 401);
    newcomer.allowFailure('/auth/invitations/accept', 400);
    const invited = await newcomer.newPage();
    // The first link no longer works.
    await invited.goto(firstHref);
    await invited.getByLabel('New password').fill('a long mixing-desk passphrase');
    await invited.getByLabel('Repeat the password').fill('a long mixing-desk passphrase');
    await invited.getByRole('button', { name: 'Set password' }).click();
    await invited
      .getByText(/This invitation link (is not valid|has already been used)/)
      .first()
      .waitFor();
    await invited.goto(href);
    await invited.getByRole('heading', { name: 'Set your password' }).waitFor();
    await invited.getByLabel('New password').fill('short');
    await invited.getByLabel('Repeat the password').fill('short');
    await invited.getByRole('button', { name: 'Set password' }).click();
    await invited.getByText('Use at least 12 characters (5 so far).').waitFor();
    await screenshot(invited, 'accept-invitation');
    await invited.getByLabel('New password').fill('a long mixing-desk passphrase');
    await invited.getByLabel('Repeat the password').fill('a long mixing-desk passphrase');
    await invited.getByRole('button', { name: 'Set password' }).click();
    await invited.waitForURL(`${service.origin}/`);
    await invited.getByRole('heading', { name: 'Overview' }).waitFor();
    await invited.getByRole('button', { name: /Account: mix\.engineer@kestrel\.example/ }).click();
    expect(await invited.getByTestId('session-role').textContent()).toContain('Developer');
    expect(newcomer.faults()).toEqual([]);
  } finally {
    await newcomer.close();
  }
});

it('changes the new colleague’s role and disables the account after confirmation', async () => {
  await openPage(page, service.origin, '/users', 'Users');
  const row = page.getByRole('row', { name: /mix\.engineer@kestrel\.example/ });
  await row.getByRole('combobox', { name: 'Role of mix.engineer@kestrel.example' }).click();
  await page.getByRole('option', { name: 'Viewer' }).click();
  await page.getByText('mix.engineer@kestrel.example is now viewer.').waitFor();
  await row.getByRole('button', { name: 'Disable' }).click();
  await page.getByTestId('confirm-action').click();
  await row.getByText('Disabled').waitFor();
  await page.reload();
  await row.getByText('Disabled').waitFor();
  await screenshot(page, 'users');
});

it('links to the API reference, which loads without leaving the machine', async () => {
  await openPage(page, service.origin, '/reference', 'API documentation');
  await screenshot(page, 'reference');
  await page.getByTestId('docs-link').click();
  await page.waitForURL(`${service.origin}/docs/`);
  await page.locator('.swagger-ui').first().waitFor();
  await page.getByText('Isochron API').first().waitFor();
  await page.waitForTimeout(1000);
});
