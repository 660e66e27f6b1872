/**
 * Architecture boundaries, read from the real import graph so a new file cannot slip past them:
 *
 * - A feature folder under `src/app/` imports only from itself, `core/`, `ui/`, `flight/` and the
 *   project's `shared/` — never from another feature. What two features need lives in `core/` (state,
 *   services) or `ui/` (presentational pieces).
 * - `core/`, `ui/` and `flight/` never import from a feature.
 * - Routers (`api/**\/*.router.ts`) parse, call a service and respond: no database tables, no Drizzle,
 *   no SQL. The ones listed in `ROUTERS_STILL_QUERYING` predate the rule; the list may only shrink.
 */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';

const ROOT = resolve(dirname(new URL(import.meta.url).pathname), '../..');
const APP = join(ROOT, 'src/app');
const SHARED_LAYERS = new Set(['core', 'ui', 'flight']);

/** TODO(lead): move these routers' queries into their services (issue on conventions), then empty the list. */
const ROUTERS_STILL_QUERYING = new Set(['api/exports/exports.router.ts']);

function filesUnder(dir: string, suffix: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) out.push(...filesUnder(path, suffix));
    else if (name.endsWith(suffix)) out.push(path);
  }
  return out;
}

/** Relative import specifiers of a module (static imports, re-exports and dynamic imports). */
function relativeImports(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  return [...text.matchAll(/(?:from|import)\s*\(?\s*['"](\.{1,2}\/[^'"]+)['"]/g)].map((m) => m[1]);
}

/** The top folder under `src/app/` a path belongs to, `shared` for the project's shared/, or null. */
function areaOf(path: string): string | null {
  if (path.startsWith(join(ROOT, 'shared') + sep)) return 'shared';
  const rel = relative(APP, path);
  if (rel.startsWith('..')) return null;
  const parts = rel.split(sep);
  return parts.length > 1 ? parts[0] : null;
}

describe('Architecture boundaries', () => {
  const appFiles = filesUnder(APP, '.ts');

  it('has no feature importing from another feature', () => {
    const crossings: string[] = [];
    for (const file of appFiles) {
      const from = areaOf(file);
      if (from === null || SHARED_LAYERS.has(from)) continue;
      for (const spec of relativeImports(file)) {
        const to = areaOf(resolve(dirname(file), spec));
        if (to === null || to === from || to === 'shared' || SHARED_LAYERS.has(to)) continue;
        crossings.push(`${relative(ROOT, file)} → ${spec}`);
      }
    }
    expect(crossings).toEqual([]);
  });

  it('keeps core/, ui/ and flight/ free of feature imports', () => {
    const crossings: string[] = [];
    for (const file of appFiles) {
      const from = areaOf(file);
      if (from === null || !SHARED_LAYERS.has(from)) continue;
      for (const spec of relativeImports(file)) {
        const to = areaOf(resolve(dirname(file), spec));
        if (to === null || to === 'shared' || SHARED_LAYERS.has(to)) continue;
        crossings.push(`${relative(ROOT, file)} → ${spec}`);
      }
    }
    expect(crossings).toEqual([]);
  });

  it('keeps database access out of routers', () => {
    const querying: string[] = [];
    for (const file of filesUnder(join(ROOT, 'api'), '.router.ts')) {
      const text = readFileSync(file, 'utf8');
      const touchesDb =
        /from ['"](?:drizzle-orm[^'"]*|better-sqlite3)['"]/.test(text) ||
        // A type-only import of `Db` (to hand the connection to a service) is fine; tables and queries are not.
        /import\s+(?!type\b)[^;]*?from\s+['"][^'"]*\/db\/(?:schema|client)['"]/.test(text) ||
        /\.prepare\(|\bsql`|(?<!router)\.(?:select|insert|update|delete)\(|\.transaction\(/.test(text);
      if (touchesDb) querying.push(relative(ROOT, file));
    }
    const newOnes = querying.filter((f) => !ROUTERS_STILL_QUERYING.has(f));
    expect(newOnes).withContext('routers must not query the database; move it into the service').toEqual([]);
    const cleaned = [...ROUTERS_STILL_QUERYING].filter((f) => !querying.includes(f));
    expect(cleaned).withContext('these routers no longer query: remove them from ROUTERS_STILL_QUERYING').toEqual([]);
  });
});
