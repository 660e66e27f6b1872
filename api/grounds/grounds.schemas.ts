/** Request schemas of `/api/grounds` (the body schema is shared with the Club admin form). */
import * as z from 'zod';

export { groundInputSchema } from '../../shared/schemas/grounds';

/** `:id` of a ground route. */
export const groundIdSchema = z.uuid({ error: 'id must be a UUID' });
