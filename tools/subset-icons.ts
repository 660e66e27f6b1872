/**
 * `npm run icons:subset`: writes `src/icons/icon-names.json` (the symbols the app uses, found by
 * `icon-names.ts`) and `src/icons/loftline-symbols.woff2`, a Material Symbols font cut down to them
 * (about 75 icons instead of 3,900: a few kB instead of 490). Run it after adding an icon; the spec
 * `spec/tools/icon-names.spec.ts` fails until you do. Needs Debian's python3-fonttools and python3-brotli.
 */
import { spawnSync } from 'node:child_process';
import { statSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { usedSymbolNames } from './icon-names';

export const ICON_NAMES_FILE = resolve('src/icons/icon-names.json');
const FONT_OUT = resolve('src/icons/loftline-symbols.woff2');
const FONT_IN = resolve('node_modules/@material-symbols/font-400/material-symbols-outlined.woff2');

const names = usedSymbolNames();
writeFileSync(ICON_NAMES_FILE, JSON.stringify(names, null, 2) + '\n');
const python = process.env['PYTHON'] ?? '/usr/bin/python3';
const result = spawnSync(python, [resolve('tools/subset_icons.py'), FONT_IN, ICON_NAMES_FILE, FONT_OUT], { stdio: 'inherit' });
if (result.status !== 0) {
  console.error('Subsetting failed: install fontTools and brotli (apt-get install python3-fonttools python3-brotli).');
  process.exit(1);
}
console.log(`${names.length} icons → ${FONT_OUT} (${(statSync(FONT_OUT).size / 1000).toFixed(1)} kB)`);
