/**
 * Refuses JSON bodies that are shaped to attack rather than to be read: keys that reach an
 * object's prototype (`__proto__`, `constructor`, `prototype` — the classic prototype-pollution
 * payloads) and nesting deeper than any Loftline payload needs. Runs once after `express.json`
 * so every route gets it, including values a schema only passes through (`z.unknown()`).
 */
import type { RequestHandler } from 'express';
import { Invalid } from './errors';

/** Keys no Loftline payload uses and that can reach `Object.prototype` when merged naively. */
const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/** Deepest nesting allowed (a push is body → mutations → mutation → data → conditionsSource: 5). */
export const MAX_JSON_DEPTH = 16;

/** Finds the first forbidden key or over-deep value; returns its dotted path and the reason. */
export function unsafeJsonPath(value: unknown): { field: string; message: string } | null {
  // Iterative walk: a hostile body must not be able to overflow the stack of the check itself.
  const stack: { v: unknown; path: string[] }[] = [{ v: value, path: [] }];
  while (stack.length) {
    const { v, path } = stack.pop()!;
    if (v === null || typeof v !== 'object') continue;
    if (path.length >= MAX_JSON_DEPTH)
      return { field: path.join('.') || 'body', message: `Nested more than ${MAX_JSON_DEPTH} levels deep` };
    for (const key of Object.keys(v)) {
      if (FORBIDDEN_KEYS.has(key)) return { field: [...path, key].join('.'), message: 'This key is not allowed' };
      stack.push({ v: (v as Record<string, unknown>)[key], path: [...path, key] });
    }
  }
  return null;
}

/** Middleware: 400 naming the offending path when the parsed JSON body is unsafe. */
export const refuseUnsafeJson: RequestHandler = (req, _res, next) => {
  const bad = unsafeJsonPath(req.body);
  if (bad) throw new Invalid(`The request body is refused — ${bad.field}: ${bad.message}`, [bad]);
  next();
};
