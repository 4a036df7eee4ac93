import { HttpRequest } from '@angular/common/http';
import { HttpTestingController, TestRequest } from '@angular/common/http/testing';

/**
 * The one open request matching `match`, once the page has made it (a few ticks after a click, a closed
 * dialog or an answered write). `whenStable` and harness actions would instead wait for the answer itself:
 * a resource's request keeps the page unstable until it is answered.
 */
export async function requested(
  http: HttpTestingController,
  detectChanges: () => void,
  match: string | ((request: HttpRequest<unknown>) => boolean),
): Promise<TestRequest> {
  for (let tick = 0; tick < 50; tick++) {
    detectChanges();
    const found = http.match(match);
    if (found.length > 1) throw new Error(`${found.length} requests for ${String(match)}`);
    if (found.length === 1) return found[0];
    await new Promise((resolve) => setTimeout(resolve));
  }
  throw new Error(`no request for ${String(match)}`);
}

/** Clicks an element without waiting for the page to be stable (see `requested`). */
export async function clickNow(element: Element | null | undefined, detectChanges: () => void) {
  if (!element) throw new Error('nothing to click');
  (element as HTMLElement).click();
  detectChanges();
  await new Promise((resolve) => setTimeout(resolve));
}
