import { Router, type RequestHandler } from 'express';
import swaggerUi from 'swagger-ui-express';
import type { OpenApiDocument } from '../openapi/document';

/** The contract as JSON and as Swagger UI at /docs (its page needs inline styles and scripts). */
export function docsRouter(document: OpenApiDocument): Router {
  const router = Router();
  router.get('/openapi.json', (_req, res) => {
    res.json(document);
  });
  const relaxedPolicy: RequestHandler = (_req, res, next) => {
    res.setHeader(
      'Content-Security-Policy',
      "default-src 'self'; script-src 'self' 'unsafe-inline'; style-src 'self' 'unsafe-inline'; img-src 'self' data:; connect-src 'self'",
    );
    next();
  };
  router.use(
    '/docs',
    relaxedPolicy,
    swaggerUi.serve,
    swaggerUi.setup(document, {
      customSiteTitle: 'Isochron API',
      swaggerOptions: { persistAuthorization: false, tryItOutEnabled: false },
    }),
  );
  return router;
}
