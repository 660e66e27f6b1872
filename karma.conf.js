// Karma configuration for the Angular specs beside the code in src/, run through
// `ng test` (builder @angular/build:karma). package.json says "type": "module", so this
// file is an ES module; Karma 6 loads it with require(), which Node >= 20.19 allows for
// ES modules without top-level await, and then takes the default export.
import karmaJasmine from 'karma-jasmine';
import karmaChromeLauncher from 'karma-chrome-launcher';
import karmaCoverage from 'karma-coverage';
import { join } from 'node:path';

/**
 * Chromium flags needed on the CI machines: the tests run as root (so no sandbox) in a
 * container without a GPU and with a small /dev/shm, and must not phone home.
 */
const CI_CHROMIUM_FLAGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-dev-shm-usage',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

/**
 * Prints one machine-readable line when the run ends, e.g. `Karma: 41 passed, 0 failed, 0 skipped`,
 * so a script can add the Karma counts to those of the other test runners without
 * parsing the progress reporter's carriage-return output.
 * @param {(reporter: object) => void} baseReporterDecorator
 */
function SummaryLineReporter(baseReporterDecorator) {
  baseReporterDecorator(this);
  // The progress reporter already prints every spec failure; this one only adds the totals.
  this.onSpecComplete = () => {};
  this.onBrowserLog = () => {};
  /** @param {unknown} _browsers @param {{ success: number, failed: number, skipped: number, error: boolean }} results */
  this.onRunComplete = (_browsers, results) => {
    const errored = results.error ? ' (run errored)' : '';
    this.write(`Karma: ${results.success} passed, ${results.failed} failed, ${results.skipped} skipped${errored}\n`);
  };
}
SummaryLineReporter.$inject = ['baseReporterDecorator'];

/** @param {import('karma').Config} config */
export default function karmaConfig(config) {
  config.set({
    basePath: '',
    frameworks: ['jasmine'],
    plugins: [karmaJasmine, karmaChromeLauncher, karmaCoverage, { 'reporter:summary-line': ['type', SummaryLineReporter] }],
    client: {
      jasmine: {
        random: true,
        // Specs that wait for the flight worker or IndexedDB wait for a condition, not a time; this
        // is only the ceiling. Jasmine's 5 s default was hit on a loaded 2-core machine (load
        // average 20+) by specs that pass in 1 s on a quiet one.
        timeoutInterval: 30000,
      },
    },
    coverageReporter: {
      dir: join(import.meta.dirname, 'coverage', 'loftline'),
      subdir: '.',
      reporters: [{ type: 'html' }, { type: 'text-summary' }],
    },
    reporters: ['progress', 'summary-line'],
    browsers: ['ChromeHeadlessCI'],
    customLaunchers: {
      ChromeHeadlessCI: {
        base: 'ChromeHeadless',
        flags: CI_CHROMIUM_FLAGS,
      },
    },
    browserNoActivityTimeout: 120000,
    captureTimeout: 120000,
    singleRun: true,
    restartOnFileChange: false,
  });
}
