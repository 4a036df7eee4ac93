import type { PlaygroundOperation } from './openapi-operations';
import { buildDraft } from './request-draft';

const operation: PlaygroundOperation = {
  id: 'getUsage',
  method: 'GET',
  path: '/v1/things/{thingId}',
  summary: '',
  description: '',
  tag: 'Usage',
  open: false,
  bodyRequired: false,
  examples: [],
  parameters: [
    { name: 'thingId', in: 'path', required: true, description: '', example: '' },
    { name: 'route', in: 'query', required: false, description: '', example: '' },
    { name: 'groupBy', in: 'query', required: false, description: '', example: '' },
    { name: 'X-Trace', in: 'header', required: false, description: '', example: '' },
  ],
};

describe('buildDraft', () => {
  it('encodes path values so an id cannot change the route, and builds the query', () => {
    const { draft, problems } = buildDraft(
      operation,
      {
        'path:thingId': '../keys?x=1',
        'query:route': 'POST /v1/biquads',
        'query:groupBy': '',
        'header:X-Trace': 'abc',
      },
      undefined,
    );
    expect(problems).toEqual([]);
    expect(draft).toEqual({
      method: 'GET',
      url: '/v1/things/..%2Fkeys%3Fx%3D1?route=POST+%2Fv1%2Fbiquads',
      headers: [['X-Trace', 'abc']],
      body: undefined,
    });
  });

  it('reports missing required parameters and bodies', () => {
    const { problems } = buildDraft({ ...operation, bodyRequired: true }, {}, undefined);
    expect(problems).toEqual([
      { field: 'thingId', message: 'thingId is required' },
      { field: 'body', message: 'this operation needs a request body' },
    ]);
  });

  it('sends JSON bodies re-indented with a content type', () => {
    const { draft } = buildDraft(
      { ...operation, method: 'POST' },
      { 'path:thingId': 'a' },
      { sampleRateHz: 48000 },
    );
    expect(draft.headers).toEqual([['Content-Type', 'application/json']]);
    expect(draft.body).toBe('{\n  "sampleRateHz": 48000\n}');
  });
});
