// `npm run fuzz [-- --n 100000] [--seed 1] [--formats csv,parquet] [--time-bound-ms 10000]`: a long
// fuzzing campaign over every reader; prints the counts by outcome per format and each finding
// (format, index, what was thrown). Exits 1 when there are findings. The same seed and index give
// the same mutant, so a finding is reproduced with --formats <f> --from <index> --n 1.
import { ALLOCATION_LIMIT, formatReports, runCampaign } from './campaign';
import { FORMATS, type FuzzFormat } from './seeds';

const args = process.argv.slice(2);
const value = (name: string, fallback: string) => {
  const at = args.indexOf(name);
  return at >= 0 && args[at + 1] !== undefined ? args[at + 1] : fallback;
};
const n = Number(value('--n', '10000'));
const from = Number(value('--from', '0'));
const seed = Number(value('--seed', '1'));
const timeBoundMs = Number(value('--time-bound-ms', '10000'));
const formats = value('--formats', FORMATS.join(',')).split(',') as FuzzFormat[];
for (const f of formats) {
  if (!(FORMATS as readonly string[]).includes(f)) {
    console.error(`fuzz: unknown format "${f}" (expected some of ${FORMATS.join(', ')})`);
    process.exit(2);
  }
}
if (!Number.isInteger(n) || n < 1 || !Number.isInteger(from) || from < 0 || !Number.isInteger(seed) || !(timeBoundMs > 0)) {
  console.error('fuzz: --n, --from and --seed take whole numbers (n ≥ 1, from ≥ 0), --time-bound-ms a positive number');
  process.exit(2);
}

console.log(`fuzz: ${n} mutants per format, campaign seed ${seed}, ${timeBoundMs} ms per mutant at most, formats ${formats.join(', ')}`);
let last = Date.now();
const { reports, findings } = await runCampaign({
  formats, n, from, seed, timeBoundMs, allocationLimit: ALLOCATION_LIMIT,
  onProgress: (format, done) => {
    if (Date.now() - last > 30_000) {
      last = Date.now();
      console.log(`fuzz: ${format} ${done} / ${n}`);
    }
  },
});
console.log(`\n${formatReports(reports)}`);
for (const f of findings) console.log(`finding: ${f.format} #${f.index} ${f.outcome}: ${f.detail}`);
console.log(findings.length ? `\nfuzz: ${findings.length} finding(s)` : '\nfuzz: no findings');
process.exit(findings.length ? 1 : 0);
