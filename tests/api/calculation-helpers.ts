import request from 'supertest';
import type { Response } from 'supertest';
import type { TestContext } from '../support/test-context';

/** POSTs JSON to a calculation route with the calculate-role key. */
export function poster(ctx: () => TestContext, path: string) {
  return (body: unknown): Promise<Response> =>
    request(ctx().app)
      .post(path)
      .set('Authorization', `Bearer ${ctx().keys.calculate}`)
      .send(body as object);
}

/** POSTs a raw string with the given content type. */
export function rawPoster(ctx: () => TestContext, path: string) {
  return (text: string, contentType: string): Promise<Response> =>
    request(ctx().app)
      .post(path)
      .set('Authorization', `Bearer ${ctx().keys.calculate}`)
      .set('Content-Type', contentType)
      .send(text);
}

/** Asserts an RFC 9457 problem with this status that names `pointer` among its field errors. */
export function expectProblem(res: Response, status: number, pointer?: string): void {
  expect(res.status).toBe(status);
  expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
  expect(res.body).toMatchObject({ status, type: expect.any(String), title: expect.any(String) });
  expect(JSON.stringify(res.body)).not.toMatch(/at .+\.(ts|js):\d+/);
  if (pointer !== undefined) {
    const pointers = (res.body.errors ?? []).map((e: { pointer: string }) => e.pointer);
    expect(pointers).toContain(pointer);
  }
}

/** `{ a: { a: { ... } } }` nested `depth` levels deep. */
export function deeplyNested(depth: number): unknown {
  let value: unknown = 'junk';
  for (let i = 0; i < depth; i++) value = { a: value };
  return value;
}
