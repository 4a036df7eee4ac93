import { HttpClient, HttpHeaders, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { CONSOLE_HEADER, CONSOLE_HEADER_VALUE, consoleHeaderInterceptor } from './console-header.interceptor';
import { sessionExpiryInterceptor } from './session-expiry.interceptor';
import { SessionService } from './session.service';

describe('consoleHeaderInterceptor', () => {
  let client: HttpClient;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([consoleHeaderInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    client = TestBed.inject(HttpClient);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('marks a request to the console’s own origin, by path or by full address', () => {
    client.post('/v1/rooms', {}).subscribe();
    client.get(`${window.location.origin}/auth/session`).subscribe();
    expect(http.expectOne('/v1/rooms').request.headers.get(CONSOLE_HEADER)).toBe(CONSOLE_HEADER_VALUE);
    expect(http.expectOne(`${window.location.origin}/auth/session`).request.headers.get(CONSOLE_HEADER)).toBe(
      'isochron-console',
    );
  });

  it('never sends the header to another origin, including a protocol-relative address', () => {
    client.get('https://elsewhere.example/v1/rooms').subscribe();
    client.get('//elsewhere.example/v1/rooms').subscribe();
    expect(http.expectOne('https://elsewhere.example/v1/rooms').request.headers.has(CONSOLE_HEADER)).toBe(
      false,
    );
    expect(http.expectOne('//elsewhere.example/v1/rooms').request.headers.has(CONSOLE_HEADER)).toBe(false);
  });

  it('leaves a header the caller set itself alone', () => {
    client.get('/v1/keys', { headers: new HttpHeaders({ [CONSOLE_HEADER]: 'custom' }) }).subscribe();
    expect(http.expectOne('/v1/keys').request.headers.getAll(CONSOLE_HEADER)).toEqual(['custom']);
  });
});

describe('sessionExpiryInterceptor', () => {
  let client: HttpClient;
  let http: HttpTestingController;
  let session: SessionService;
  let router: Router;
  let navigate: ReturnType<typeof vi.spyOn>;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([sessionExpiryInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    client = TestBed.inject(HttpClient);
    http = TestBed.inject(HttpTestingController);
    session = TestBed.inject(SessionService);
    router = TestBed.inject(Router);
    const signedIn = firstValueFrom(session.signIn('dev@example.test', 'pw'));
    http.expectOne('/auth/session').flush({
      user: { id: 'usr_1', email: 'dev@example.test', role: 'developer' },
      permissions: ['tuning'],
    });
    await signedIn;
    navigate = vi.spyOn(router, 'navigate').mockResolvedValue(true);
  });

  afterEach(() => http.verify());

  async function fail(url: string, status: number, headers?: HttpHeaders): Promise<unknown> {
    const result = firstValueFrom(client.get(url, { headers }));
    http.expectOne(url).flush({ title: 'x' }, { status, statusText: String(status) });
    return result.catch((error: unknown) => error);
  }

  it('on a 401 from a console call forgets the user and sends them to sign in, passing the error on', async () => {
    const error = await fail('/v1/rooms', 401);
    expect(error).toMatchObject({ status: 401 });
    expect(session.signedIn()).toBe(false);
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { next: '/', expired: 1 } });
  });

  it('leaves the playground’s own-key 401s to the playground', async () => {
    await fail('/v1/rooms', 401, new HttpHeaders({ Authorization: 'Bearer iso_test_x' }));
    expect(session.signedIn()).toBe(true);
    expect(navigate).not.toHaveBeenCalled();
  });

  it('ignores other statuses and calls outside /v1/', async () => {
    expect(await fail('/v1/rooms', 403)).toMatchObject({ status: 403 });
    await fail('/auth/session', 401);
    expect(session.signedIn()).toBe(true);
    expect(navigate).not.toHaveBeenCalled();
  });

  it('does nothing when nobody was signed in', async () => {
    session.forget();
    await fail('/v1/usage', 401);
    expect(navigate).not.toHaveBeenCalled();
  });
});
