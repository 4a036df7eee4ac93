import { loadOpenApiDocument } from '../../api/openapi/document';
import { LIMITS } from '../../shared/limits';
import { contractBounds } from '../support/contract-bounds';

const limits: Record<string, object> = LIMITS;
const found = contractBounds(loadOpenApiDocument());

describe('every bound of the contract comes from shared/limits.ts', () => {
  it.each(found.map((b) => [b.where, b] as const))('%s', (_where, bound) => {
    const entry = limits[bound.key] ?? limits[bound.name];
    expect({ key: bound.key, bounds: entry }).toEqual({ key: bound.key, bounds: bound.bounds });
  });

  it('has no entry the contract does not use', () => {
    const used = new Set(found.flatMap((b) => [b.key, b.name]));
    expect(Object.keys(LIMITS).filter((key) => !used.has(key))).toEqual([]);
  });

  it('would notice a bound that differs from its entry', () => {
    const document = loadOpenApiDocument();
    const schemas = document.components.schemas as Record<string, { maximum?: number }>;
    schemas.SampleRateHz.maximum = 192000;
    const changed = contractBounds(document).find((b) => b.key === 'SampleRateHz');
    expect(changed?.bounds).not.toEqual(limits.SampleRateHz);
  });
});
