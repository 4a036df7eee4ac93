import { loadOpenApiDocument } from '../../../../api/openapi/document';
import { groupByTag, listOperations, resolvePointer } from './openapi-operations';
import type { OpenApiDocument } from './openapi-types';

const miniDocument: OpenApiDocument = {
  openapi: '3.1.0',
  tags: [{ name: 'Calculations' }, { name: 'Keys' }],
  paths: {
    '/v1/keys/{keyId}': {
      parameters: [{ $ref: '#/components/parameters/KeyId' }],
      patch: {
        operationId: 'updateKey',
        summary: 'Rename a key',
        tags: ['Keys'],
        requestBody: {
          required: true,
          content: {
            'application/json': {
              schema: { $ref: '#/components/schemas/Update' },
              examples: {
                rename: { summary: 'Rename', value: { name: 'Sweep rig' } },
                shared: { $ref: '#/components/examples/Shared' },
              },
            },
          },
        },
      },
    },
    '/v1/analysis/impulse-response': {
      post: {
        operationId: 'analyseImpulseResponse',
        tags: ['Calculations'],
        requestBody: { content: { 'multipart/form-data': { schema: { type: 'object' } } } },
      },
    },
    '/healthz': {
      get: {
        operationId: 'health',
        security: [],
        parameters: [{ name: 'verbose', in: 'query', schema: { type: 'boolean', default: false } }],
      },
    },
  },
  components: {
    parameters: {
      KeyId: { name: 'keyId', in: 'path', required: true, schema: { type: 'string', examples: ['key_abc'] } },
    },
    schemas: { Update: { type: 'object', properties: { name: { type: 'string' } } } },
    examples: { Shared: { summary: 'Shared example', value: { name: 'Shared' } } },
  },
};

describe('resolvePointer', () => {
  it('follows #/ pointers with ~0 and ~1 escapes', () => {
    expect(resolvePointer({ a: { 'b/c': { '~d': 7 } } }, '#/a/b~1c/~0d')).toBe(7);
    expect(resolvePointer({}, '#/missing')).toBeUndefined();
    expect(resolvePointer({}, 'other.yaml#/x')).toBeUndefined();
  });
});

describe('listOperations', () => {
  const operations = listOperations(miniDocument);

  it('merges path-level parameters, resolves references and takes examples from the schema', () => {
    const update = operations.find((operation) => operation.id === 'updateKey')!;
    expect(update).toMatchObject({
      method: 'PATCH',
      path: '/v1/keys/{keyId}',
      tag: 'Keys',
      bodyType: 'application/json',
      bodyRequired: true,
      open: false,
    });
    expect(update.parameters).toEqual([
      {
        name: 'keyId',
        in: 'path',
        required: true,
        description: '',
        schema: { type: 'string', examples: ['key_abc'] },
        example: 'key_abc',
      },
    ]);
    expect(update.examples).toEqual([
      { name: 'rename', summary: 'Rename', value: { name: 'Sweep rig' } },
      { name: 'shared', summary: 'Shared example', value: { name: 'Shared' } },
    ]);
  });

  it('marks uploads as not sendable from the playground and open operations as needing no key', () => {
    expect(operations.find((operation) => operation.id === 'analyseImpulseResponse')?.unsupported).toContain(
      'multipart/form-data',
    );
    const health = operations.find((operation) => operation.id === 'health')!;
    expect(health.open).toBe(true);
    expect(health.parameters[0].example).toBe('false');
  });
});

describe('groupByTag', () => {
  it('orders groups as the document lists its tags', () => {
    const groups = groupByTag(listOperations(miniDocument), ['Calculations', 'Keys']);
    expect(groups.map((group) => group.tag)).toEqual(['Calculations', 'Keys', 'Other']);
  });
});

describe('listOperations on the contract', () => {
  const contract = loadOpenApiDocument() as unknown as OpenApiDocument;
  const operations = listOperations(contract);

  it('gives every operation a unique id and a summary, and every JSON body operation an example', () => {
    const ids = operations.map((operation) => operation.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const operation of operations) {
      expect({ id: operation.id, summary: Boolean(operation.summary) }).toEqual({
        id: operation.id,
        summary: true,
      });
      if (operation.bodySchema && !operation.unsupported) {
        expect({ id: operation.id, examples: operation.examples.length > 0 }).toEqual({
          id: operation.id,
          examples: true,
        });
      }
    }
  });
});
