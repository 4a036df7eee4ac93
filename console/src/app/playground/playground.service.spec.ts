import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { PlaygroundCredentials } from './playground-credentials.service';
import { PlaygroundService } from './playground.service';
import type { RequestDraft } from './request-draft';

const draft: RequestDraft = {
  method: 'POST',
  url: '/v1/delays?units=ms',
  headers: [['Idempotency-Key', 'abc-123']],
  body: '{ "speedOfSoundMps": 343 }',
};

describe('PlaygroundService', () => {
  let playground: PlaygroundService;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    playground = TestBed.inject(PlaygroundService);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('fetches the served contract once per page load', async () => {
    const first = firstValueFrom(playground.document());
    const second = firstValueFrom(playground.document());
    http.expectOne('/openapi.json').flush({ openapi: '3.1.0', paths: {} });
    expect(await first).toEqual({ openapi: '3.1.0', paths: {} });
    expect(await second).toBe(await first);
  });

  it('sends a key as a bearer token, trimmed, and leaves the session cookie home', async () => {
    const answer = firstValueFrom(playground.send(draft, { kind: 'key', secret: '  iso_test_secret \n' }));
    const request = http.expectOne('/v1/delays?units=ms');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toBe(draft.body);
    expect(request.request.headers.get('Authorization')).toBe('Bearer iso_test_secret');
    expect(request.request.headers.get('Idempotency-Key')).toBe('abc-123');
    expect(request.request.credentials).toBe('omit');
    request.flush('{"delays":[]}', { headers: { 'Content-Type': 'application/json', 'X-Request-Id': 'r1' } });

    const response = await answer;
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ delays: [] });
    expect(response.bodyText).toBe('{"delays":[]}');
    expect(response.headers).toEqual([
      ['content-type', 'application/json'],
      ['x-request-id', 'r1'],
    ]);
  });

  it('uses the session without an Authorization header when no key is chosen', () => {
    playground.send({ ...draft, method: 'GET', body: undefined }, { kind: 'session' }).subscribe();
    const request = http.expectOne('/v1/delays?units=ms');
    expect(request.request.headers.has('Authorization')).toBe(false);
    expect(request.request.credentials).toBe('same-origin');
    request.flush('');
  });

  it('keeps a non-JSON body as text only', async () => {
    const answer = firstValueFrom(playground.send(draft, { kind: 'session' }));
    http.expectOne('/v1/delays?units=ms').flush('a,b\n1,2\n', { headers: { 'Content-Type': 'text/csv' } });
    const response = await answer;
    expect(response.bodyText).toBe('a,b\n1,2\n');
    expect(response.body).toBeUndefined();
  });

  it('answers a refusal as a response with the problem parsed, not as an error', async () => {
    const answer = firstValueFrom(playground.send(draft, { kind: 'session' }));
    http.expectOne('/v1/delays?units=ms').flush('{"title":"Unprocessable","status":422}', {
      status: 422,
      statusText: 'Unprocessable Content',
      headers: { 'Content-Type': 'application/problem+json' },
    });
    const response = await answer;
    expect(response.status).toBe(422);
    expect(response.statusText).toBe('Unprocessable Content');
    expect(response.body).toEqual({ title: 'Unprocessable', status: 422 });
  });

  it('says "No answer" when the server cannot be reached', async () => {
    const answer = firstValueFrom(playground.send(draft, { kind: 'session' }));
    http.expectOne('/v1/delays?units=ms').error(new ProgressEvent('error'), { status: 0 });
    const response = await answer;
    expect(response.status).toBe(0);
    expect(response.statusText).toBe('No answer');
  });
});

describe('PlaygroundCredentials', () => {
  it('holds the offered secret and label in memory only', () => {
    const credentials = TestBed.inject(PlaygroundCredentials);
    const before = JSON.stringify({ ...localStorage });
    credentials.offer('iso_live_abc', 'Sweep rig');
    expect(credentials.keySecret()).toBe('iso_live_abc');
    expect(credentials.keyLabel()).toBe('Sweep rig');
    expect(JSON.stringify({ ...localStorage })).toBe(before);
  });
});
