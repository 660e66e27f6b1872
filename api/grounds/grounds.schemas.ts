/** Request schemas of `/api/grounds` (the body schema is shared with the Club admin form). */

export { groundInputSchema } from '../../shared/schemas/grounds';

/** `:id` of a ground route. */
export { idSchema as groundIdSchema } from '../id-param';
