import { Router } from 'express';
import { findLayout, LAYOUTS } from '../../shared/layouts';
import { requirePermission } from '../auth/permissions';
import { notFound } from '../http/problem';
import { validate } from '../http/validate';

/** The BS.2051-3 layouts and 9.1.6: reference data, readable by every role that may calculate. */
export function layoutsRouter(): Router {
  const router = Router();
  router.get(
    '/layouts',
    requirePermission('calculate'),
    validate('listLayouts', (_input, _req, res) => {
      res.json({ data: LAYOUTS, hasMore: false });
    }),
  );

  router.get(
    '/layouts/:layoutId',
    requirePermission('calculate'),
    validate('getLayout', ({ params }, _req, res) => {
      const layout = findLayout(params.layoutId);
      if (!layout)
        throw notFound(`No layout "${params.layoutId}". GET /v1/layouts lists the ids and aliases.`);
      res.json(layout);
    }),
  );
  return router;
}
