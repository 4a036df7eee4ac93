import type { Request } from 'express';
import { loadOpenApiDocument, type OpenApiDocument } from '../openapi/document';
import { compileRequestCost } from './request-cost';

/** The parts of a request the cost reads, relative to the /v1 mount as the limiters see it. */
function req(method: string, url: string, body: unknown = {}, contentType = 'application/json'): Request {
  const path = url.split('?')[0];
  return {
    method,
    url,
    path,
    body,
    is: (type: string) => (contentType.startsWith(type) ? type : false),
  } as unknown as Request;
}

describe('compileRequestCost (the contract)', () => {
  const cost = compileRequestCost(loadOpenApiDocument());

  it.each([
    ['POST', '/plans', 20],
    ['POST', '/PLANS/', 20],
    ['POST', '/plans?x=1', 20],
    ['GET', '/plans', 1],
    ['POST', '/eq/fit', 10],
    ['POST', '/Eq/Fit', 10],
    ['POST', '/eq', 1],
    ['POST', '/analysis/impulse-response', 10],
    ['POST', '/analysis/sweep', 1],
    ['POST', '/biquads', 1],
    ['POST', '/%70lans', 1],
    ['POST', '//plans', 1],
    // A stored room's plan runs the same engine and fits as POST /plans.
    ['POST', '/rooms/room_1/plans', 20],
    ['GET', '/rooms/room_1/plans', 1],
  ])('%s %s costs %d', (method, url, expected) => {
    expect(cost(req(method, url))).toBe(expected);
  });

  it('charges an upload of a measurement, not its JSON form', () => {
    expect(cost(req('POST', '/rooms/r1/measurements', {}, 'multipart/form-data; boundary=x'))).toBe(10);
    expect(cost(req('POST', '/rooms/r1/measurements', {}))).toBe(1);
    expect(cost(req('POST', '/rooms/r1/measurements/average', {}, 'multipart/form-data'))).toBe(1);
  });

  it('charges a tuning made from a plan, not one made from settings', () => {
    expect(cost(req('POST', '/rooms/r1/tunings', { plan: {} }))).toBe(20);
    expect(cost(req('POST', '/rooms/r1/tunings', { settings: {} }))).toBe(1);
    expect(cost(req('GET', '/rooms/r1/tunings'))).toBe(1);
  });
});

describe('compileRequestCost (paths whose first segment is a parameter)', () => {
  const document = {
    openapi: '3.1.0',
    info: { title: 't', version: '1' },
    paths: {
      '/v1/{scope}/heavy': { post: { operationId: 'a', 'x-rate-limit-cost': 5, responses: {} } },
      '/v1/fixed/heavy': { post: { operationId: 'b', 'x-rate-limit-cost': 3, responses: {} } },
    },
  } as unknown as OpenApiDocument;
  const cost = compileRequestCost(document);

  it('tries the exact path first, then a parameter in any first segment', () => {
    expect(cost(req('POST', '/fixed/heavy'))).toBe(3);
    expect(cost(req('POST', '/other/heavy'))).toBe(5);
    expect(cost(req('POST', '/other/light'))).toBe(1);
    expect(cost(req('GET', '/other/heavy'))).toBe(1);
  });
});
