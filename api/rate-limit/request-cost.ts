import type { Request, RequestHandler } from 'express';
import type { Store } from 'express-rate-limit';
import { getContract } from '../http/validate';
import { HTTP_METHODS, type OpenApiDocument, type OpenApiOperation } from '../openapi/document';

/** What a request spends of a rate limit, in units; 1 unless its operation says otherwise. */
export type RequestCost = (req: Request) => number;

/** The contract's extension naming an operation's cost: `x-rate-limit-cost: 20`. */
const COST_EXTENSION = 'x-rate-limit-cost';

export interface OperationCost {
  operationId: string;
  method: string;
  path: string;
  cost: number;
}

/** Every operation of the contract with a cost other than 1. */
export function operationCosts(document: OpenApiDocument): OperationCost[] {
  const costs: OperationCost[] = [];
  for (const [path, item] of Object.entries(document.paths)) {
    for (const method of HTTP_METHODS) {
      const operation = item?.[method] as (OpenApiOperation & { [COST_EXTENSION]?: unknown }) | undefined;
      const cost = operation?.[COST_EXTENSION];
      if (cost === undefined) continue;
      if (typeof cost !== 'number' || !Number.isInteger(cost) || cost < 1) {
        throw new Error(
          `${method.toUpperCase()} ${path}: ${COST_EXTENSION} must be a whole number of at least 1`,
        );
      }
      costs.push({ operationId: operation?.operationId ?? '', method: method.toUpperCase(), path, cost });
    }
  }
  return costs;
}

/**
 * The cost of a request under `mountPath` (the rate limiters run before routing, so this matches the
 * method and path itself, the way the routers will). Cheap checks first: most requests use a method no
 * costly operation has, or miss the map of paths without parameters; paths with parameters are few
 * regular expressions. Express routes ignore case and a trailing slash, and so does this.
 */
export function compileRequestCost(document: OpenApiDocument, mountPath = '/v1'): RequestCost {
  const exact = new Map<string, number>();
  const patterns: Array<{ method: string; pattern: RegExp; cost: number }> = [];
  for (const { method, path, cost } of operationCosts(document)) {
    if (!path.startsWith(`${mountPath}/`)) throw new Error(`${path}: a cost applies under ${mountPath} only`);
    const relative = path.slice(mountPath.length).toLowerCase();
    if (relative.includes('{')) {
      const source = relative.replace(/[.*+?^$()|[\]\\]/g, '\\$&').replace(/\{[^}]+\}/g, '[^/]+');
      patterns.push({ method, pattern: new RegExp(`^${source}/?$`, 'i'), cost });
    } else {
      exact.set(`${method} ${relative}`, cost);
    }
  }
  const methods = new Set(
    [...exact.keys()].map((k) => k.split(' ')[0]).concat(patterns.map((p) => p.method)),
  );
  return (req) => {
    if (!methods.has(req.method)) return 1;
    let path = req.path.toLowerCase();
    if (path.length > 1 && path.endsWith('/')) path = path.slice(0, -1);
    const cost = exact.get(`${req.method} ${path}`);
    if (cost !== undefined) return cost;
    for (const p of patterns) if (p.method === req.method && p.pattern.test(path)) return p.cost;
    return 1;
  };
}

let fromContract: RequestCost | null = null;
/** The costs the contract gives (compiled once). */
export function contractRequestCost(): RequestCost {
  fromContract ??= compileRequestCost(getContract().document);
  return fromContract;
}

/**
 * A rate limiter preceded by the charge of a costly request's units beyond the one the limiter counts
 * itself, on the same store and key. The limiter then adds its unit and compares the total with the
 * limit, so a request that does not fit is refused, the `RateLimit` header counts units, and a request
 * of cost 1 goes straight to the limiter.
 */
export function withCost(
  limiter: RequestHandler,
  store: Store,
  key: (req: Request) => string,
  cost: RequestCost,
): RequestHandler {
  return (req, res, next) => {
    const extra = cost(req) - 1;
    if (extra <= 0) {
      limiter(req, res, next);
      return;
    }
    const subject = key(req);
    let charged: Promise<unknown> = Promise.resolve();
    for (let i = 0; i < extra; i += 1) charged = charged.then(() => store.increment(subject));
    charged.then(() => limiter(req, res, next), next);
  };
}
