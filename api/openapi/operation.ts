/**
 * The shape of one documented API operation (the reference page and the route-coverage spec read it): method,
 * Express path, who may call it, the zod schemas of its query and body, and exactly one kind of success.
 */
import type * as z from 'zod';
import { ROLES, STAFF_ROLES, type Role } from '../../shared/roles';

/** Who may call an operation: anyone, or signed-in users of these roles. */
export type Access = 'public' | readonly Role[];

/** What every documented operation has. */
interface OperationBase {
  readonly method: 'GET' | 'POST' | 'PUT' | 'DELETE';
  /** Express path under `/api`, e.g. `/api/players/:id`. */
  readonly path: string;
  readonly tag: string;
  readonly summary: string;
  readonly access: Access;
  readonly query?: z.ZodType;
  readonly body?: z.ZodType;
  /** A multipart upload (`file` field) instead of a JSON body. */
  readonly upload?: boolean;
  /** Whether success is 201 Created. */
  readonly created?: boolean;
}

/**
 * One documented operation. Its success is exactly one of: a JSON answer with its schema, a non-JSON answer
 * of a content type, or 204 without a body — so an operation cannot be added without saying what it answers.
 */
export type Operation = OperationBase &
  (
    | {
        /** The JSON answer's schema (the spec parses real answers with it). */
        readonly answer: z.ZodType;
        readonly produces?: never;
        readonly noContent?: never;
      }
    | {
        /** Content type of a non-JSON answer. */
        readonly produces: 'text/csv' | 'text/html' | 'text/javascript';
        readonly answer?: never;
        readonly noContent?: never;
      }
    | {
        /** Success is 204 without a body. */
        readonly noContent: true;
        readonly answer?: never;
        readonly produces?: never;
      }
  );

/** Staff roles, for operations any coach may call. */
export const STAFF: readonly Role[] = STAFF_ROLES;
/** Every signed-in role. */
export const ALL: readonly Role[] = ROLES;
