import type { Request } from 'express';
import { getContract } from '../http/validate';
import { HTTP_METHODS, type OpenApiDocument, type OpenApiOperation } from '../openapi/document';

/** What a request spends of a rate limit, in units; 1 unless its operation says otherwise. */
export type RequestCost = (req: Request) => number;

/** The contract's extension naming an operation's cost: `x-rate-limit-cost: 20`. */
const COST_EXTENSION = 'x-rate-limit-cost';
/**
 * Where an operation is heavy in one form only, that form: `multipart/form-data` (a file upload; the
 * JSON form is cheap) or the name of a body member (`plan`: a tuning made from a plan, not from settings).
 */
const WHEN_EXTENSION = 'x-rate-limit-cost-when';

export interface OperationCost {
  operationId: string;
  method: string;
  path: string;
  cost: number;
  when?: string;
}

type CostedOperation = OpenApiOperation & { [COST_EXTENSION]?: unknown; [WHEN_EXTENSION]?: unknown };

/** Every operation of the contract with a cost other than 1. */
export function operationCosts(document: OpenApiDocument): OperationCost[] {
  const costs: OperationCost[] = [];
  for (const [path, item] of Object.entries(document.paths)) {
    for (const method of HTTP_METHODS) {
      const operation = item?.[method] as CostedOperation | undefined;
      const cost = operation?.[COST_EXTENSION];
      if (cost === undefined) continue;
      const where = `${method.toUpperCase()} ${path}`;
      if (typeof cost !== 'number' || !Number.isInteger(cost) || cost < 1) {
        throw new Error(`${where}: ${COST_EXTENSION} must be a whole number of at least 1`);
      }
      const when = operation?.[WHEN_EXTENSION];
      if (when !== undefined && typeof when !== 'string') {
        throw new Error(`${where}: ${WHEN_EXTENSION} must be a string`);
      }
      costs.push({
        operationId: operation?.operationId ?? '',
        method: method.toUpperCase(),
        path,
        cost,
        ...(when !== undefined && { when }),
      });
    }
  }
  return costs;
}

/** Whether a request is in the costly form of its operation. */
function inCostlyForm(when: string | undefined): (req: Request) => boolean {
  if (when === undefined) return () => true;
  if (when === 'multipart/form-data') return (req) => req.is('multipart/form-data') === when;
  return (req) => {
    const body: unknown = req.body;
    return typeof body === 'object' && body !== null && (body as Record<string, unknown>)[when] !== undefined;
  };
}

interface Rule {
  cost: number;
  applies: (req: Request) => boolean;
}

/** The first segment of a path relative to the mount point, lower case (`/Eq/fit?x` → `eq`). */
function firstSegment(url: string): string {
  const end = url.slice(1).search(/[/?]/);
  return (end < 0 ? url.slice(1) : url.slice(1, end + 1)).toLowerCase();
}

/**
 * The cost of a request under `mountPath` (the rate limiters run before routing, so this matches the
 * method and path itself, the way the routers will). Cheap checks first, worked out once per route
 * template: the rules are filed by method and first path segment, so most requests (a method or a first
 * segment no costly operation has, like `POST /v1/biquads`) cost one map look-up; only the few others
 * match their whole path. Express routes ignore case and a trailing slash, and so does this.
 */
export function compileRequestCost(document: OpenApiDocument, mountPath = '/v1'): RequestCost {
  type PathRule = Rule & { exact: boolean; matches: (path: string) => boolean };
  const bySegment = new Map<string, PathRule[]>();
  /** Rules whose first segment is a parameter: they may apply to any first segment of their method. */
  const anySegment = new Map<string, PathRule[]>();
  // Paths without parameters before those with, as the map of exact paths was tried first before.
  const file = (map: Map<string, PathRule[]>, key: string, rule: PathRule) =>
    map.set(
      key,
      [...(map.get(key) ?? []), rule].sort((a, b) => Number(b.exact) - Number(a.exact)),
    );
  for (const { method, path, cost, when } of operationCosts(document)) {
    if (!path.startsWith(`${mountPath}/`)) throw new Error(`${path}: a cost applies under ${mountPath} only`);
    const relative = path.slice(mountPath.length).toLowerCase();
    let matches: (path: string) => boolean;
    const exact = !relative.includes('{');
    if (!exact) {
      const source = relative.replace(/[.*+?^$()|[\]\\]/g, '\\$&').replace(/\{[^}]+\}/g, '[^/]+');
      const pattern = new RegExp(`^${source}/?$`, 'i');
      matches = (p) => pattern.test(p);
    } else {
      matches = (p) => p === relative;
    }
    const rule: PathRule = { cost, applies: inCostlyForm(when), exact, matches };
    const first = firstSegment(relative);
    if (first.includes('{')) file(anySegment, method, rule);
    else file(bySegment, `${method} ${first}`, rule);
  }
  return (req) => {
    const own = bySegment.get(`${req.method} ${firstSegment(req.url)}`);
    const any = anySegment.get(req.method);
    if (own === undefined && any === undefined) return 1;
    let path = req.path.toLowerCase();
    if (path.length > 1 && path.endsWith('/')) path = path.slice(0, -1);
    for (const rules of [own, any]) {
      for (const rule of rules ?? []) if (rule.matches(path)) return rule.applies(req) ? rule.cost : 1;
    }
    return 1;
  };
}

let fromContract: RequestCost | null = null;
/** The costs the contract gives (compiled once). */
export function contractRequestCost(): RequestCost {
  fromContract ??= compileRequestCost(getContract().document);
  return fromContract;
}
