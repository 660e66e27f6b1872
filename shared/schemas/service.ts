/**
 * Answers of the service calls a deployment and an integrator use before any sign-in matters: readiness
 * and the OpenAPI document itself.
 */
import * as z from 'zod';

/** Answer of `GET /api/ready` when the database can be read (otherwise 503 with an error body). */
export const readinessSchema = z.object({ ready: z.literal(true) }).meta({ id: 'Readiness' });

/**
 * Answer of `GET /api/openapi.json`: an OpenAPI 3.1 document. Only its frame is described here; the
 * OpenAPI 3.1 specification defines the rest.
 */
export const openApiDocumentSchema = z
  .looseObject({
    openapi: z.string().regex(/^3\.1\.\d+$/),
    info: z.looseObject({ title: z.string(), version: z.string() }),
    paths: z.record(z.string(), z.looseObject({})),
  })
  .meta({ id: 'OpenApiDocument' });
