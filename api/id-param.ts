import * as z from 'zod';

/** The one schema of a UUID route parameter (`:id`, `:playerId`): parse with `parseOrThrow(idSchema, req.params['id'], 'Player id')`. */
export const idSchema = z.uuid({ error: 'id must be a UUID' });
