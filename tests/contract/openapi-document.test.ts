import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { listOperations, loadOpenApiDocument, resolveParameter } from '../../api/openapi/document';

const document = loadOpenApiDocument();
const operations = listOperations(document);

describe('the OpenAPI document', () => {
  it('is a valid OpenAPI 3.1 document (checked by @seriousme/openapi-schema-validator against the official schema)', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'isochron-openapi-'));
    const file = path.join(dir, 'openapi.json');
    writeFileSync(file, JSON.stringify(document));
    try {
      const cli = require.resolve('@seriousme/openapi-schema-validator/bin/validate-api-cli.js');
      const result = spawnSync(process.execPath, [cli, file], { encoding: 'utf8' });
      // On failure the validator prints its errors; show them rather than only an exit code.
      expect(result.stdout + result.stderr).toMatch(/"valid": true/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('declares OpenAPI 3.1', () => {
    expect(document.openapi).toMatch(/^3\.1\./);
  });

  it.each(operations.map((o) => [`${o.method.toUpperCase()} ${o.route}`, o.operation] as const))(
    '%s has an operationId, a summary, a tag and error responses',
    (_name, operation) => {
      expect(operation.operationId).toMatch(/^[a-z][A-Za-z0-9]+$/);
      expect(typeof operation.summary).toBe('string');
      expect((operation.tags as string[] | undefined)?.length ?? 0).toBeGreaterThan(0);
      const statuses = Object.keys(operation.responses ?? {});
      expect(statuses.some((s) => s.startsWith('2'))).toBe(true);
      expect(statuses.some((s) => s.startsWith('4'))).toBe(true);
    },
  );

  it.each(operations.map((o) => [`${o.method.toUpperCase()} ${o.route}`, o.operation] as const))(
    '%s documents at least one worked example',
    (_name, operation) => {
      const parameters = (operation.parameters ?? []).map((p) => resolveParameter(document, p));
      const serialized = JSON.stringify({
        requestBody: operation.requestBody,
        responses: operation.responses,
        parameters,
      });
      expect(serialized).toMatch(/"examples?"/);
    },
  );

  it('uses no OpenAPI 3.0-only words (nullable)', () => {
    expect(JSON.stringify(document)).not.toMatch(/"nullable"/);
  });
});
