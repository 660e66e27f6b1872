/**
 * A Jasmine helper that writes pass/fail counts to `$LOFTLINE_SPEC_COUNTS` (when set), so
 * `npm test` can sum every runner into one `N passed, N failed` line without parsing text.
 */
import { writeFileSync } from 'node:fs';

const target = process.env['LOFTLINE_SPEC_COUNTS'];
if (target) {
  let passed = 0;
  let failed = 0;
  let skipped = 0;
  jasmine.getEnv().addReporter({
    specDone(result) {
      if (result.status === 'passed') passed++;
      else if (result.status === 'failed') failed++;
      else skipped++;
    },
    suiteDone(result) {
      // A failing afterAll counts as a failure of the suite.
      if (result.status === 'failed') failed++;
    },
    jasmineDone(result) {
      if (result.overallStatus === 'failed' && failed === 0) failed++;
      writeFileSync(target, JSON.stringify({ passed, failed, skipped }));
    },
  });
}
