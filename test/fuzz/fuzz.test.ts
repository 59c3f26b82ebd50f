// The fuzzing campaign of the test suite: 2,000 seeded mutants of each format (campaign.ts), each
// either read or refused with the project's located error; none may throw anything else, take
// longer than the time bound, or ask for more memory than the allocation limit. `npm run fuzz --
// --n 100000` runs the same campaign longer.
import { describe, expect, it } from 'vitest';
import { ALLOCATION_LIMIT, formatReports, runCampaign } from './campaign';
import { FORMATS } from './seeds';

const N = 2000;

describe('mutation fuzzing of every reader', () => {
  it(`reads or refuses each of ${N} mutants per format, with no other outcome`, { timeout: 600_000 }, async () => {
    const { reports, findings } = await runCampaign({ formats: FORMATS, n: N, seed: 20261203, timeBoundMs: 10_000, allocationLimit: ALLOCATION_LIMIT });
    console.log(`fuzz: ${N} mutants per format\n${formatReports(reports)}`);
    expect(findings, findings.map((f) => `${f.format} #${f.index} ${f.outcome}: ${f.detail}`).join('\n')).toEqual([]);
    for (const r of reports) {
      expect(r.counts.read + r.counts.refused).toBe(N);
      // A campaign where every mutant is refused would not reach the readers' inner code.
      expect(r.counts.read, r.format).toBeGreaterThan(0);
    }
  });
});
