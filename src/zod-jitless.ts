/**
 * zod compiles object parsers with `new Function` after probing whether eval is allowed; our
 * Content-Security-Policy forbids it, so the probe logs a violation. This makes zod interpret instead.
 *
 * It writes zod's global settings object (zod 4 keeps it on `globalThis.__zod_globalConfig` so that
 * every copy of zod shares one) rather than calling `config()` from 'zod': importing zod from the entry
 * module would put its whole runtime into the first download, because esbuild places every module the
 * entry can reach in the initial chunks, used or not. Works whether zod has loaded yet or not (it
 * keeps the object it finds). `spec/tools/zod-jitless.spec.ts` checks that zod reads it.
 */
export function interpretZodParsers(): void {
  const holder = globalThis as { __zod_globalConfig?: Record<string, unknown> };
  holder.__zod_globalConfig = Object.assign(holder.__zod_globalConfig ?? {}, { jitless: true });
}
