/**
 * Runs axe-core (the npm package, injected from node_modules) in a page and reports the
 * violations that fail a spec, readably: rule id, impact, target selectors and the help URL.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Page } from 'playwright-core';

/** The axe build injected into pages, read once. */
let axeSource: string | null = null;

/**
 * WCAG 2.2 level AA, which includes every A and AA success criterion of 2.0 and 2.1 (axe-core's
 * tags for them). W3C, "Web Content Accessibility Guidelines (WCAG) 2.2", Recommendation.
 */
export const WCAG_22_AA_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

/** Impacts that fail a spec. */
const BLOCKING_IMPACTS = new Set(['serious', 'critical']);

/** One axe violation, reduced to what a failure message needs. */
export interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  helpUrl: string;
  targets: string[];
  summaries: string[];
}

/** The part of axe's result the specs read (axe's own types are not loaded into Node). */
interface AxeRawResult {
  violations: {
    id: string;
    impact?: string | null;
    help: string;
    helpUrl: string;
    nodes: { target: unknown[]; failureSummary?: string }[];
  }[];
}

/**
 * Injects axe-core into the page unless it is already there (navigations drop it). Evaluated
 * through the DevTools protocol rather than added as a `<script>`: the app's Content Security
 * Policy (`script-src 'self'`) rightly refuses inline scripts, and the page is tested as served.
 */
async function ensureAxe(page: Page): Promise<void> {
  const present = await page.evaluate(() => 'axe' in window);
  if (present) return;
  axeSource ??= readFileSync(resolve('node_modules/axe-core/axe.min.js'), 'utf8');
  await page.evaluate(axeSource);
}

/**
 * Runs axe over the whole document with the given tags (default WCAG 2.2 AA) or, with
 * `rules`, only those rules. Returns every violation; callers decide which impacts fail.
 */
export async function runAxe(page: Page, options: { tags?: string[]; rules?: string[] } = {}): Promise<AxeViolation[]> {
  await ensureAxe(page);
  const runOnly = options.rules ? { type: 'rule', values: options.rules } : { type: 'tag', values: options.tags ?? WCAG_22_AA_TAGS };
  const result = await page.evaluate(async (only) => {
    const axe = (window as unknown as { axe: { run(context: Document, options: object): Promise<unknown> } }).axe;
    return (await axe.run(document, { runOnly: only, resultTypes: ['violations'] })) as AxeRawResult;
  }, runOnly);
  return result.violations.map((v) => ({
    id: v.id,
    impact: v.impact ?? null,
    help: v.help,
    helpUrl: v.helpUrl,
    targets: v.nodes.map((n) => n.target.map(String).join(' ')),
    summaries: v.nodes.map((n) => n.failureSummary ?? ''),
  }));
}

/** Only the serious and critical violations. */
export function blocking(violations: readonly AxeViolation[]): AxeViolation[] {
  return violations.filter((v) => v.impact !== null && BLOCKING_IMPACTS.has(v.impact));
}

/** A readable list of violations, one rule per paragraph, each target on its own line. */
export function formatViolations(where: string, violations: readonly AxeViolation[]): string {
  if (violations.length === 0) return `${where}: no violations`;
  const parts = violations.map((v) => {
    const nodes = v.targets.map((t, i) => `    - ${t}\n      ${v.summaries[i].replace(/\n/g, '\n      ')}`).join('\n');
    return `  [${v.impact}] ${v.id}: ${v.help}\n    ${v.helpUrl}\n${nodes}`;
  });
  return `${where}:\n${parts.join('\n')}`;
}

/** The two themes every screen is checked in (the app follows `prefers-color-scheme`). */
export const THEMES = ['light', 'dark'] as const;

/** One screen's audit in one theme: the failing violations and what the screen showed. */
export interface ThemeAudit {
  theme: (typeof THEMES)[number];
  blocking: AxeViolation[];
  minor: AxeViolation[];
  unnamedGraphics: string[];
}

/**
 * Graphics that neither carry an accessible name nor are hidden from assistive technology.
 * Our d3 charts are `role="img"` (or `group` when interactive) with an `aria-label` summary and
 * a data table beside them; decorative drawings are `aria-hidden`. WCAG 2.2 SC 1.1.1 Non-text
 * Content.
 */
export async function unnamedGraphics(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const found: string[] = [];
    for (const svg of Array.from(document.querySelectorAll('svg'))) {
      if (svg.parentElement?.closest('svg')) continue;
      if (svg.closest('[aria-hidden="true"]')) continue;
      const role = svg.getAttribute('role');
      const name = (svg.getAttribute('aria-label') ?? '').trim() || (svg.getAttribute('aria-labelledby') ?? '').trim();
      if ((role === 'img' || role === 'group' || role === 'figure') && name !== '') continue;
      const host = svg.parentElement;
      const where = host ? host.tagName.toLowerCase() + ' > ' : '';
      found.push(`${where}svg${svg.id ? '#' + svg.id : ''}[class="${svg.getAttribute('class') ?? ''}"]`);
    }
    return found;
  });
}

/**
 * Audits the screen showing now in the light and then the dark theme, by emulating the
 * device's colour-scheme preference, and checks that the theme really changed (chalk behind
 * the light theme, a dark background behind the dark one) before axe runs. With
 * `enhancedContrast`, text must also reach 7:1 (WCAG 2.2 SC 1.4.6 Contrast (Enhanced), axe's
 * `color-contrast-enhanced`), which the product asks of Pitchside for use in sunlight.
 */
export async function auditInBothThemes(page: Page, options: { enhancedContrast?: boolean } = {}): Promise<ThemeAudit[]> {
  const audits: ThemeAudit[] = [];
  for (const theme of THEMES) {
    await page.emulateMedia({ colorScheme: theme });
    await page.waitForFunction((dark) => {
      const [r, g, b] = (getComputedStyle(document.body).backgroundColor.match(/\d+/g) ?? []).map(Number);
      const light = r + g + b > 600;
      return dark ? !light : light;
    }, theme === 'dark');
    // Let transitions and ripples settle so contrast is measured on the final colours.
    await page.waitForTimeout(250);
    const violations = await runAxe(page);
    const enhanced = options.enhancedContrast ? await runAxe(page, { rules: ['color-contrast-enhanced'] }) : [];
    audits.push({
      theme,
      blocking: [...blocking(violations), ...enhanced],
      minor: violations.filter((v) => v.impact === null || !BLOCKING_IMPACTS.has(v.impact)),
      unnamedGraphics: await unnamedGraphics(page),
    });
  }
  return audits;
}
