/**
 * Which Material Symbols the app uses, found in its source: the text of `<mat-icon>` elements, the
 * quoted names inside their bindings (`{{ on ? 'visibility_off' : 'visibility' }}`), and every other
 * quoted string in a file that shows icons (`icon: 'home'`, `return 'cloud_done'`) that is the name of
 * a symbol. A literal that only happens to be a symbol's name adds one small glyph to the font; a name
 * this misses would show as a word, so it errs on the side of including.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

/** The names of every symbol in the full font, from the package's own type list. */
export function allSymbolNames(): Set<string> {
  const source = readFileSync(resolve('node_modules/@material-symbols/font-400/index.d.ts'), 'utf8');
  return new Set([...source.matchAll(/"([a-z0-9_]+)"/g)].map((m) => m[1]));
}

function* sourceFiles(dir: string): Generator<string> {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) yield* sourceFiles(path);
    else if (/\.(ts|html)$/.test(entry.name) && !entry.name.endsWith('.spec.ts')) yield path;
  }
}

/** The symbol names the app under `srcDir` uses, sorted. */
export function usedSymbolNames(srcDir = resolve('src/app')): string[] {
  const known = allSymbolNames();
  const used = new Set<string>();
  for (const file of sourceFiles(srcDir)) {
    const text = readFileSync(file, 'utf8');
    if (!/mat-icon|\bicon\b/i.test(text)) continue;
    for (const m of text.matchAll(/<mat-icon\b[^>]*>([^<]*)<\/mat-icon>/g)) {
      const content = m[1].trim();
      if (known.has(content)) used.add(content);
    }
    for (const m of text.matchAll(/'([a-z0-9_]+)'|"([a-z0-9_]+)"/g)) {
      const name = m[1] ?? m[2];
      if (known.has(name)) used.add(name);
    }
  }
  return [...used].sort();
}
