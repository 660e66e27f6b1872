import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { allSymbolNames, usedSymbolNames } from '../../tools/icon-names';

describe('the cut-down icon font', () => {
  it('holds every icon the app names (run `npm run icons:subset` after adding one)', () => {
    const inFont = new Set(JSON.parse(readFileSync(resolve('src/icons/icon-names.json'), 'utf8')) as string[]);
    const missing = usedSymbolNames().filter((name) => !inFont.has(name));
    expect(missing).withContext('icons used but not in src/icons/loftline-symbols.woff2').toEqual([]);
  });

  it('finds icons in element text, in bindings and in typed lists', () => {
    const used = new Set(usedSymbolNames());
    // sign-in.html: `<mat-icon …>mail</mat-icon>` and `{{ passwordVisible() ? 'visibility_off' : 'visibility' }}`;
    // nav-items.ts: `icon: 'sports_soccer'`; sync-badge.ts: `return 'cloud_done'`.
    for (const name of ['mail', 'visibility_off', 'visibility', 'sports_soccer', 'cloud_done']) {
      expect(used.has(name)).withContext(name).toBeTrue();
    }
    expect(allSymbolNames().size).toBeGreaterThan(3000);
  });
});
