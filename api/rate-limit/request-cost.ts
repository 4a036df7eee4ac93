import type { Request, RequestHandler } from 'express';
import type { Store } from 'express-rate-limit';
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

/**
 * The cost of a request under `mountPath` (the rate limiters run before routing, so this matches the
 * method and path itself, the way the routers will). Cheap checks first: most requests use a method no
 * costly operation has, or miss the map of paths without parameters; paths with parameters are few
 * regular expressions. Express routes ignore case and a trailing slash, and so does this.
 */
export function compileRequestCost(document: OpenApiDocument, mountPath = '/v1'): RequestCost {
  const exact = new Map<string, Rule>();
  const patterns: Array<Rule & { method: string; pattern: RegExp }> = [];
  for (const { method, path, cost, when } of operationCosts(document)) {
    if (!path.startsWith(`${mountPath}/`)) throw new Error(`${path}: a cost applies under ${mountPath} only`);
    const relative = path.slice(mountPath.length).toLowerCase();
    const rule: Rule = { cost, applies: inCostlyForm(when) };
    if (relative.includes('{')) {
      const source = relative.replace(/[.*+?^$()|[\]\\]/g, '\\$&').replace(/\{[^}]+\}/g, '[^/]+');
      patterns.push({ ...rule, method, pattern: new RegExp(`^${source}/?$`, 'i') });
    } else {
      exact.set(`${method} ${relative}`, rule);
    }
  }
  const methods = new Set(
    [...exact.keys()].map((k) => k.split(' ')[0]).concat(patterns.map((p) => p.method)),
  );
  const costOf = (rule: Rule, req: Request) => (rule.applies(req) ? rule.cost : 1);
  return (req) => {
    if (!methods.has(req.method)) return 1;
    let path = req.path.toLowerCase();
    if (path.length > 1 && path.endsWith('/')) path = path.slice(0, -1);
    const rule = exact.get(`${req.method} ${path}`);
    if (rule) return costOf(rule, req);
    for (const p of patterns) if (p.method === req.method && p.pattern.test(path)) return costOf(p, req);
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
