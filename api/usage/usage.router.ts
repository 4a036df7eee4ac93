import { Router } from 'express';
import { can, principalOf, requirePermission } from '../auth/permissions';
import { badRequest, forbidden } from '../http/problem';
import { countActiveKeys } from '../keys/key-service';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { usageCsv } from './usage-csv';
import { usageReport } from './usage-report';

const DAY_MS = 86_400_000;
const DEFAULT_SPAN_MS = 7 * DAY_MS;
const MAX_SPAN_MS = 400 * DAY_MS;

/** `GET /v1/usage`: metered calls, the caller's own with `usage:own`, everyone's with `usage:all`. */
export function usageRouter(services: Services): Router {
  const router = Router();

  router.get(
    '/usage',
    requirePermission('usage:own', 'usage:all'),
    validate('getUsage', async ({ query: params }, req, res) => {
      const principal = principalOf(req);
      const everyone = can(principal, 'usage:all');
      if (!everyone && params.userId !== undefined && params.userId !== principal.userId) {
        throw forbidden("Another user's usage needs the usage:all permission.");
      }
      const to = params.to ? new Date(params.to) : new Date();
      const from = params.from ? new Date(params.from) : new Date(to.getTime() - DEFAULT_SPAN_MS);
      if (from.getTime() >= to.getTime()) {
        throw badRequest('from must be before to.', [
          { pointer: '/query/from', message: 'must be before to' },
        ]);
      }
      if (to.getTime() - from.getTime() > MAX_SPAN_MS) {
        throw badRequest('The range may span at most 400 days.', [
          { pointer: '/query/from', message: 'must be at most 400 days before to' },
        ]);
      }
      const data = await usageReport(services.db, {
        ownerId: everyone ? params.userId : principal.userId,
        keyId: params.keyId,
        route: params.route,
        from,
        to,
        groupBy: params.groupBy,
      });
      if (req.accepts(['application/json', 'text/csv']) === 'text/csv') {
        res.type('text/csv; charset=utf-8').attachment('isochron-usage.csv').send(usageCsv(data));
        return;
      }
      const { config } = services;
      const oneUser = everyone ? params.userId : principal.userId;
      res.json({
        from: from.toISOString(),
        to: to.toISOString(),
        groupBy: params.groupBy,
        limits: {
          keyRateLimitPerMinute: config.defaultRateLimitPerMinute,
          userRateLimitPerMinute: config.userRateLimitPerMinute,
          maxActiveKeysPerUser: config.maxActiveKeysPerUser,
          activeKeys: oneUser ? await countActiveKeys(services.db.models, oneUser, new Date()) : null,
        },
        data,
      });
    }),
  );

  return router;
}
