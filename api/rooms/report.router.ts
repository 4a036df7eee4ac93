import { Router } from 'express';
import { callerOf } from '../auth/actor';
import { requirePermission } from '../auth/permissions';
import { validate } from '../http/validate';
import type { Services } from '../services';
import { roomReportHtml } from './room-report.service';

const REPORT_POLICY =
  "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

/** GET /v1/rooms/{roomId}/report: the client's print-ready HTML report of a room and one of its tunings. */
export function roomReportRouter({ db }: Services): Router {
  const router = Router();
  router.get(
    '/rooms/:roomId/report',
    requirePermission('tuning'),
    validate('getRoomReport', async ({ params, query }, req, res) => {
      const html = await roomReportHtml(db, callerOf(req), params.roomId, query, new Date());
      // A document, unlike the other API answers: its inline <style> and inline SVG may apply, nothing
      // else may load (no scripts, no fetches), and no other site may frame it.
      res.setHeader('Content-Security-Policy', REPORT_POLICY);
      res.type('text/html; charset=utf-8').send(html);
    }),
  );
  return router;
}
