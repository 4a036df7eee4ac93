import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioButtonHarness } from '@angular/material/radio/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { loadOpenApiDocument } from '../../../../../api/openapi/document';
import { designFilterSet } from '../../../../../shared/filters/filter-set';
import type { UserRole } from '../../auth/roles';
import { requested } from '../../../testing/requests';
import { signInAs } from '../../../testing/session';
import { PlaygroundCredentials } from '../playground-credentials.service';
import { PlaygroundPage } from './playground-page';

const document = loadOpenApiDocument();

/** The documented examples of an operation's JSON body, straight from the contract. */
function examplesOf(path: string, method: 'post'): Array<{ summary: string; value: unknown }> {
  const operation = (document.paths as Record<string, Record<string, unknown>>)[path][method] as {
    requestBody: {
      content: { 'application/json': { examples: Record<string, { summary: string; value: unknown }> } };
    };
  };
  return Object.values(operation.requestBody.content['application/json'].examples);
}

describe('PlaygroundPage', () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;
  let loader: HarnessLoader;

  const byTestId = <T extends Element = HTMLElement>(id: string) =>
    harness.routeNativeElement!.querySelector<T & Element>(`[data-testid="${id}"]`);
  const text = () => harness.routeNativeElement!.textContent!.replace(/\s+/g, ' ');
  const sendButton = () =>
    loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="send-request"]' }));

  async function settle() {
    harness.detectChanges();
    await harness.fixture.whenStable();
  }

  async function render(
    role: UserRole,
    url = '/playground',
    answer: 'document' | 'fail' = 'document',
    before: () => void = () => undefined,
  ) {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'playground', component: PlaygroundPage }], withComponentInputBinding()),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    await signInAs(role);
    before();
    harness = await RouterTestingHarness.create();
    const navigation = harness.navigateByUrl(url);
    const request = await requested(http, () => undefined, '/openapi.json');
    if (answer === 'document') request.flush(document);
    else request.flush({ title: 'Service unavailable', status: 503 }, { status: 503, statusText: 'x' });
    await navigation;
    await settle();
    loader = TestbedHarnessEnvironment.loader(harness.fixture);
  }

  /** Types into the body editor as a person would. */
  async function typeBody(value: string) {
    const editor = byTestId<HTMLTextAreaElement>('body-editor')!;
    editor.value = value;
    editor.dispatchEvent(new Event('input'));
    await settle();
  }

  afterEach(() => http.verify());

  it('opens on a single filter design with its documented example, checked against the schema', async () => {
    await render('developer');
    const select = await loader.getHarness(
      MatSelectHarness.with({ selector: '[data-testid="operation-select"]' }),
    );
    expect(await select.getValueText()).toContain('POST /v1/biquads');
    const editor = byTestId<HTMLTextAreaElement>('body-editor')!;
    expect(JSON.parse(editor.value)).toEqual(examplesOf('/v1/biquads', 'post')[0].value);
    expect(text()).toContain('Matches the schema.');
    // The lead is the description's first paragraph, its markup shown as elements.
    expect(harness.routeNativeElement!.querySelector('.lead em')?.textContent).toBe('Audio EQ Cookbook');
    expect(harness.routeNativeElement!.querySelector('.lead a')?.getAttribute('href')).toBe(
      '/docs/#/Calculations/designBiquads',
    );
    expect(byTestId('snippet-curl')?.textContent).toContain('/v1/biquads');
    expect(text()).toContain('Nothing sent yet.');
  });

  it('sends the body with the console session and shows the answer with its plot', async () => {
    await render('developer');
    await (await sendButton()).click();
    const sent = http.expectOne('/v1/biquads');
    expect(sent.request.method).toBe('POST');
    const body = JSON.parse(byTestId<HTMLTextAreaElement>('body-editor')!.value);
    expect(JSON.parse(sent.request.body as string)).toEqual(body);
    expect(sent.request.headers.has('Authorization')).toBe(false);
    expect(sent.request.credentials).toBe('same-origin');
    // The answer the API gives: the shared design it runs for this operation.
    sent.flush(JSON.stringify(designFilterSet(body)), {
      headers: { 'content-type': 'application/json; charset=utf-8', 'x-request-id': 'req_1' },
    });
    await settle();
    expect(byTestId('response-status')?.textContent?.trim()).toBe('200');
    expect(byTestId('response-plot')).not.toBeNull();
    expect(JSON.parse(byTestId('response-body')!.textContent!)).toEqual(
      JSON.parse(JSON.stringify(designFilterSet(body))),
    );
    expect(text()).toContain('Headers (2)');
  });

  it('refuses to send a body that is not JSON, and names what the schema will refuse', async () => {
    await render('developer');
    await typeBody('{ "sampleRateHz": 48000, ');
    expect(text()).toContain('The body is not valid JSON.');
    expect(await (await sendButton()).isDisabled()).toBe(true);
    expect(await (await loader.getHarness(MatButtonHarness.with({ text: 'Tidy' }))).isDisabled()).toBe(true);

    await typeBody('{"sampleRateHz": 48000, "filters": [{"type": "peaking", "frequencyHz": "56"}]}');
    const problems = byTestId('schema-problems')!.textContent!;
    expect(problems).toContain('/filters/0/frequencyHz');
    // Still sendable, to see the server's own answer.
    expect(await (await sendButton()).isDisabled()).toBe(false);
    expect(text()).toContain('You can still send it to see the server’s answer.');
    await (await sendButton()).click();
    http.expectOne('/v1/biquads').flush(
      {
        title: 'Invalid request',
        status: 400,
        detail: 'frequencyHz must be number',
        errors: [{ pointer: '/body/filters/0/frequencyHz', message: 'must be number' }],
      },
      { status: 400, statusText: 'Bad Request', headers: { 'content-type': 'application/problem+json' } },
    );
    await settle();
    expect(byTestId('response-status')?.textContent?.trim()).toBe('400');
    expect(
      harness.routeNativeElement!.querySelector('iso-response-panel [role="alert"]')?.textContent,
    ).toContain('Invalid request — frequencyHz must be number');
  });

  it('tidies a valid body', async () => {
    await render('developer');
    await typeBody('{"sampleRateHz":48000,"filters":[{"type":"notch","frequencyHz":56}]}');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Tidy' }))).click();
    expect(byTestId<HTMLTextAreaElement>('body-editor')!.value).toBe(
      JSON.stringify({ sampleRateHz: 48000, filters: [{ type: 'notch', frequencyHz: 56 }] }, null, 2),
    );
  });

  it('loads another documented example', async () => {
    await render('developer');
    const examples = examplesOf('/v1/biquads', 'post');
    expect(examples.length).toBeGreaterThan(1);
    const select = await loader.getHarness(MatSelectHarness.with({ ancestor: '.example-field' }));
    await select.clickOptions({ text: examples[1].summary.trim() });
    expect(JSON.parse(byTestId<HTMLTextAreaElement>('body-editor')!.value)).toEqual(examples[1].value);
  });

  it('keeps the chosen operation in the address and fills its path parameter', async () => {
    await render('developer', '/playground?op=getRoom');
    expect(text()).toContain('/v1/rooms/{roomId}');
    const roomId = await loader.getHarness(MatInputHarness.with({ ancestor: '.params' }));
    expect(await roomId.getValue()).not.toBe('');
    await roomId.setValue('room_stage3');
    await (await sendButton()).click();
    const sent = http.expectOne('/v1/rooms/room_stage3');
    expect(sent.request.method).toBe('GET');
    expect(sent.request.body).toBeNull();
    sent.flush({ title: 'Not found', status: 404 }, { status: 404, statusText: 'Not Found' });
    await settle();
    expect(byTestId('response-status')?.textContent?.trim()).toBe('404');

    const select = await loader.getHarness(
      MatSelectHarness.with({ selector: '[data-testid="operation-select"]' }),
    );
    await select.clickOptions({ text: /GET \/v1\/layouts — / });
    await settle();
    expect(TestBed.inject(Router).url).toBe('/playground?op=listLayouts');
    // A new operation starts with nothing sent.
    expect(byTestId('response-status')).toBeNull();
  });

  it('tells a viewer what the role allows, and sends with a pasted key only', async () => {
    await render('viewer');
    expect(byTestId('playground-role-note')?.textContent).toContain('What you can do here as Viewer');
    expect(byTestId('playground-role-note')?.textContent).toContain('a Developer or Admin gives you');
    const session = await loader.getHarness(MatRadioButtonHarness.with({ label: /My console session/ }));
    expect(await session.isDisabled()).toBe(true);
    expect(await session.getLabelText()).toContain('(not for Viewer)');
    expect(text()).toContain('Paste an API key: your role cannot send this with the console session.');
    expect(await (await sendButton()).isDisabled()).toBe(true);

    await (
      await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="playground-key"]' }))
    ).setValue(' iso_live_s3cret ');
    await (await sendButton()).click();
    const sent = http.expectOne('/v1/biquads');
    expect(sent.request.headers.get('Authorization')).toBe('Bearer iso_live_s3cret');
    // The key's answer is what code would get: the session cookie stays home.
    expect(sent.request.credentials).toBe('omit');
    sent.flush(null, { status: 0, statusText: 'Unknown Error' });
    await settle();
    expect(byTestId('response-status')?.textContent?.trim()).toBe('—');
  });

  it('starts with a key carried over from the key dialog', async () => {
    await render('developer', '/playground', 'document', () =>
      TestBed.inject(PlaygroundCredentials).offer('iso_live_carried', 'Sweep rig'),
    );
    expect(
      await (
        await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="playground-key"]' }))
      ).getValue(),
    ).toBe('iso_live_carried');
    expect(text()).toContain('Filled with “Sweep rig”.');
  });

  it('says when the API description cannot be loaded', async () => {
    await render('developer', '/playground', 'fail');
    expect(harness.routeNativeElement!.querySelector('[role="alert"]')?.textContent).toContain(
      'Could not load the API description: Service unavailable',
    );
    expect(byTestId('send-request')).toBeNull();
  });
});
