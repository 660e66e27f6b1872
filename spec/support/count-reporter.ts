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
  const durations: { name: string; ms: number }[] = [];
  jasmine.getEnv().addReporter({
    specDone(result) {
      durations.push({ name: result.fullName, ms: result.duration ?? 0 });
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
      // The slowest specs, so a run that creeps towards CI's time budget says where the time went.
      const slowest = durations.sort((a, b) => b.ms - a.ms).slice(0, 8);
      console.log(`\nSlowest specs: ${slowest.map((d) => `${(d.ms / 1000).toFixed(1)} s ${d.name}`).join('\n  ')}`);
    },
  });
}
