import request from 'supertest';
import type { OpenAPIV3_1 } from 'openapi-types';
import {
  listOperations,
  loadOpenApiDocument,
  resolveParameter,
  type OpenApiOperation,
} from '../../api/openapi/document';
import { expectToMatchContract } from '../support/contract';
import { createTestContext, type TestContext } from '../support/test-context';

function requestExamples(operation: OpenApiOperation): Array<[string, unknown]> {
  const requestBody = operation.requestBody as OpenAPIV3_1.RequestBodyObject | undefined;
  const media = requestBody?.content['application/json'];
  if (!media) return [];
  if (media.examples) {
    return Object.entries(media.examples).map(([name, e]) => [name, (e as OpenAPIV3_1.ExampleObject).value]);
  }
  return media.example === undefined ? [] : [['example', media.example]];
}

const document = loadOpenApiDocument();
/**
 * Calls that can run on an empty database: `/v1` operations without path parameters whose request,
 * if any, is JSON. Operations on stored resources are exercised with their ids in their own tests.
 */
const runnable = listOperations(document).filter(
  ({ route, method, operation }) =>
    route.startsWith('/v1/') &&
    !route.includes('{') &&
    (method === 'get' || requestExamples(operation).length > 0) &&
    !(operation.parameters ?? []).some((p) => resolveParameter(document, p).required),
);
type Case = [
  name: string,
  method: 'get' | 'post' | 'put' | 'patch' | 'delete',
  route: string,
  operationId: string,
  body: unknown,
];
const cases: Case[] = runnable.flatMap(({ route, method, operation }): Case[] => {
  const verb = method as Case[1];
  if (method === 'get') return [[`GET ${route}`, verb, route, operation.operationId, undefined]];
  return requestExamples(operation).map(([name, body]): Case => [
    `${method.toUpperCase()} ${route} (${name})`,
    verb,
    route,
    operation.operationId,
    body,
  ]);
});

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

describe('every documented example is answered as documented', () => {
  it('covers the calculation endpoints', () => {
    const routes = new Set(runnable.map((r) => r.route));
    for (const route of [
      '/v1/delays',
      '/v1/levels',
      '/v1/biquads',
      '/v1/crossovers',
      '/v1/bass-management',
    ]) {
      expect(routes).toContain(route);
    }
  });

  it.each(cases)('%s', async (_name, method, route, operationId, body) => {
    // JSON answers: operations that can also answer a file (a test signal's WAV) describe it in JSON.
    const call = request(ctx.app)[method](route).set('Authorization', `Bearer ${ctx.keys.admin}`);
    call.set('Accept', 'application/json');
    const res = body === undefined ? await call : await call.send(body as object);
    if (res.status >= 300) throw new Error(`${res.status}: ${JSON.stringify(res.body)}`);
    expectToMatchContract(operationId, res.status, res.body);
  });
});
