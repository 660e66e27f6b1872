/**
 * `npm test`: every test of the project, then one summary line `N passed, N failed`.
 *
 *  1. Node-side Jasmine specs under `spec/` (shared/, api/ with supertest, seed/).
 *  2. Karma + Jasmine for `src/**\/*.spec.ts` in headless Chromium.
 *  3. End-to-end specs in `spec/e2e/` (playwright-core driving Chromium against a real server).
 *  0. Before them, the static checks: Prettier's format check, ESLint and strict `tsc` over server, shared,
 *     specs, client and worker (tsx and esbuild strip types without checking them). Each counts as one
 *     test.
 *
 * Installs Debian's Chromium when it is missing and we are root; otherwise says what to install.
 * `--only=checks|node|karma|e2e` runs one part.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { buildClient, clientBuildIsStale } from '../api/cli/client-build';

interface Counts {
  passed: number;
  failed: number;
  skipped: number;
}

const CHROMIUM = '/usr/bin/chromium';
const only = process.argv.find((a) => a.startsWith('--only='))?.slice('--only='.length);

function ensureChromium(): void {
  if (existsSync(CHROMIUM)) return;
  if (process.getuid?.() === 0) {
    console.log('Chromium is missing; installing Debian’s chromium package (apt-get)…');
    const update = spawnSync('apt-get', ['update'], { stdio: 'inherit' });
    const install = spawnSync('apt-get', ['install', '-y', '--no-install-recommends', 'chromium'], {
      stdio: 'inherit',
      env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
    });
    if (update.status === 0 && install.status === 0 && existsSync(CHROMIUM)) return;
    throw new Error('Installing Chromium with apt-get failed; see the output above.');
  }
  throw new Error(
    `Chromium was not found at ${CHROMIUM}. Install it first, e.g. "sudo apt-get update && sudo apt-get install -y chromium", then run npm test again.`,
  );
}

function run(command: string, args: string[], env: NodeJS.ProcessEnv = {}): Promise<{ code: number; output: string }> {
  return new Promise((done) => {
    const child = spawn(command, args, { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    const tee = (chunk: Buffer, to: NodeJS.WriteStream): void => {
      output += chunk.toString();
      to.write(chunk);
    };
    child.stdout.on('data', (c: Buffer) => tee(c, process.stdout));
    child.stderr.on('data', (c: Buffer) => tee(c, process.stderr));
    child.on('close', (code) => done({ code: code ?? 1, output }));
  });
}

async function runJasmine(config: string, label: string): Promise<Counts> {
  const dir = mkdtempSync(join(tmpdir(), 'loftline-counts-'));
  const countsFile = join(dir, 'counts.json');
  console.log(`\n── ${label} ──`);
  const { code } = await run(process.execPath, ['--import', 'tsx', resolve('node_modules/jasmine/bin/jasmine.js'), `--config=${config}`], {
    LOFTLINE_SPEC_COUNTS: countsFile,
    CHROME_BIN: CHROMIUM,
  });
  let counts: Counts = { passed: 0, failed: 0, skipped: 0 };
  if (existsSync(countsFile)) counts = JSON.parse(readFileSync(countsFile, 'utf8')) as Counts;
  rmSync(dir, { recursive: true, force: true });
  if (code !== 0 && counts.failed === 0) counts.failed = 1; // the runner itself crashed
  return counts;
}

/** Reads Karma's progress output: the last `Executed N of M (K FAILED) (skipped S)` line. */
export function parseKarma(output: string): Counts | null {
  const summary = [...output.matchAll(/^Karma: (\d+) passed, (\d+) failed(?:, (\d+) skipped)?/gm)].at(-1);
  if (summary) return { passed: Number(summary[1]), failed: Number(summary[2]), skipped: Number(summary[3] ?? 0) };
  const lines = [...output.matchAll(/Executed (\d+) of (\d+)(?: \((\d+) FAILED\))?(?: \(skipped (\d+)\))?/g)];
  const last = lines.at(-1);
  if (!last) return null;
  const executed = Number(last[1]);
  const failed = Number(last[3] ?? 0);
  return { passed: executed - failed, failed, skipped: Number(last[4] ?? 0) };
}

async function runKarma(): Promise<Counts> {
  console.log('\n── Karma (src/**/*.spec.ts, headless Chromium) ──');
  const { code, output } = await run(
    resolve('node_modules/.bin/ng'),
    ['test', '--watch=false', '--browsers=ChromeHeadlessCI', '--no-progress'],
    {
      CHROME_BIN: CHROMIUM,
      NG_CLI_ANALYTICS: 'false',
    },
  );
  const counts = parseKarma(output) ?? { passed: 0, failed: 0, skipped: 0 };
  if (code !== 0 && counts.failed === 0) counts.failed = 1;
  return counts;
}

/** Static checks that must hold on every commit; each counts as one passed or failed test. */
async function runChecks(): Promise<Counts> {
  const counts: Counts = { passed: 0, failed: 0, skipped: 0 };
  const checks: [string, string[]][] = [
    ['Format (prettier --check)', [resolve('node_modules/prettier/bin/prettier.cjs'), '--check', '--log-level=warn', '.']],
    ...['api', 'app', 'spec', 'worker'].map((project): [string, string[]] => [
      `Types (tsc -p tsconfig.${project}.json)`,
      [resolve('node_modules/typescript/bin/tsc'), '-p', `tsconfig.${project}.json`, '--noEmit'],
    ]),
    ['Lint (eslint: typescript-eslint, angular-eslint)', [resolve('node_modules/eslint/bin/eslint.js'), '--max-warnings=0', '.']],
    // Copy/paste: fails when duplicated lines pass the threshold in .jscpd.json (1.44 % when it was set;
    // lower it as duplicates are folded, never raise it).
    ['Copy/paste (jscpd)', [resolve('node_modules/jscpd/bin/jscpd')]],
  ];
  for (const [label, args] of checks) {
    console.log(`\n── ${label} ──`);
    const { code } = await run(process.execPath, args);
    if (code === 0) counts.passed += 1;
    else counts.failed += 1;
  }
  return counts;
}

async function main(): Promise<void> {
  const total: Counts = { passed: 0, failed: 0, skipped: 0 };
  const add = (c: Counts): void => {
    total.passed += c.passed;
    total.failed += c.failed;
    total.skipped += c.skipped;
  };
  try {
    if (!only || only === 'checks') add(await runChecks());
    if (!only || (only !== 'node' && only !== 'checks')) ensureChromium();
    if (!only || only === 'node') add(await runJasmine('spec/support/jasmine.json', 'Node-side specs (spec/)'));
    if (!only || only === 'karma') add(await runKarma());
    if (!only || only === 'e2e') {
      if (clientBuildIsStale()) buildClient();
      add(await runJasmine('spec/support/jasmine-e2e.json', 'End-to-end specs (spec/e2e/, Chromium)'));
    }
  } catch (err) {
    console.error(err instanceof Error ? err.message : err);
    total.failed += 1;
  }
  console.log('');
  console.log(`${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ''}`);
  process.exit(total.failed > 0 ? 1 : 0);
}

void main();
