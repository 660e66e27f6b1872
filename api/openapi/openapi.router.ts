/**
 * The API reference: `GET /api/openapi.json` (OpenAPI 3.1, generated from the zod schemas) and a readable page
 * at `GET /api/reference` (our own small page and script, same origin, nothing from a CDN). Outside production
 * both are public; in production `app.ts` mounts this router behind admin sign-in only.
 */
import { readFileSync } from 'node:fs';
import { Router, type RequestHandler } from 'express';
import type { AppConfig } from '../config';
import { buildOpenApiDocument } from './document';

const PAGE = readFileSync(new URL('./page/reference.html', import.meta.url), 'utf8');
const SCRIPT = readFileSync(new URL('./page/reference.js', import.meta.url), 'utf8');

/** Builds the reference router; `guard` (production: admins only) runs before each of its routes and nothing else. */
export function openApiRouter(config: Pick<AppConfig, 'publicUrl'>, guard: RequestHandler = (_req, _res, next) => next()): Router {
  const router = Router();
  const document = buildOpenApiDocument(config.publicUrl);
  router.get('/openapi.json', guard, (_req, res) => {
    res.json(document);
  });
  router.get('/reference', guard, (_req, res) => {
    res.type('html').send(PAGE);
  });
  router.get('/reference.js', guard, (_req, res) => {
    res.type('text/javascript').send(SCRIPT);
  });
  return router;
}
