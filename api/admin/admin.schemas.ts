import * as z from 'zod';
import { ROLES } from '../../shared/roles';

/** Query of `GET /api/admin/users`: optionally one role. */
export const usersQuerySchema = z.object({ role: z.enum(ROLES, { error: `role must be one of ${ROLES.join(', ')}` }).optional() });
