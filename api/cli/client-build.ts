/**
 * Knows whether the built client is current and rebuilds it when not; shared by `npm start`
 * and `npm test` (the end-to-end specs need a production build with the service worker).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { precompressDir } from '../client/precompressed';

const CLIENT_SOURCES = [
  'src',
  'shared',
  'public',
  'angular.json',
  'ngsw-config.json',
  'tsconfig.json',
  'tsconfig.app.json',
  'tsconfig.worker.json',
  'package-lock.json',
];
const STAMP = resolve('dist/loftline/.build-stamp');

function newestMtimeMs(path: string): number {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtimeMs(join(path, entry)));
  return newest;
}

/** Whether the built client is missing or older than any of its sources. */
export function clientBuildIsStale(): boolean {
  if (!existsSync(STAMP) || !existsSync(resolve('dist/loftline/browser/index.html'))) return true;
  const built = statSync(STAMP).mtimeMs;
  return CLIENT_SOURCES.some((p) => newestMtimeMs(resolve(p)) > built);
}

/** Runs the production client build and records when it finished. */
export function buildClient(): void {
  console.log('Building the Loftline app (production build, about a minute)…');
  const ng = resolve('node_modules/.bin/ng');
  const result = spawnSync(ng, ['build', '--configuration', 'production'], {
    stdio: 'inherit',
    env: { ...process.env, NG_CLI_ANALYTICS: 'false' },
  });
  if (result.status !== 0) {
    throw new Error(`The client build failed (exit ${result.status ?? result.signal}); see the output above.`);
  }
  const packed = precompressDir(resolve('dist/loftline/browser'));
  console.log(
    `Precompressed ${packed.files} files: ${(packed.rawBytes / 1000).toFixed(0)} kB → ${(packed.brotliBytes / 1000).toFixed(0)} kB brotli.`,
  );
  writeFileSync(STAMP, new Date().toISOString() + '\n');
}
