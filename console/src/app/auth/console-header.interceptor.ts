import { HttpInterceptorFn } from '@angular/common/http';

/** Header the API's CSRF guard expects on state-changing requests from the console. */
export const CONSOLE_HEADER = 'X-Requested-With';
export const CONSOLE_HEADER_VALUE = 'isochron-console';

function isSameOrigin(url: string): boolean {
  if (url.startsWith('/') && !url.startsWith('//')) return true;
  try {
    return new URL(url, window.location.href).origin === window.location.origin;
  } catch {
    return false;
  }
}

/** Marks every same-origin request as coming from the console; other origins never get it. */
export const consoleHeaderInterceptor: HttpInterceptorFn = (request, next) => {
  if (!isSameOrigin(request.url) || request.headers.has(CONSOLE_HEADER)) return next(request);
  return next(request.clone({ setHeaders: { [CONSOLE_HEADER]: CONSOLE_HEADER_VALUE } }));
};
