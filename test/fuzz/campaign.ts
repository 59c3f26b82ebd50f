// A fuzzing campaign: for each format, mutants 0..n-1 are read in child processes (child.ts), two
// at a time; a mutant that takes longer than the time bound counts as a hang (its process is
// killed and the campaign goes on from the next mutant). Returns the counts by outcome and the
// findings, each reproducible from its format, campaign seed and index.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createInterface } from 'node:readline';
import { join } from 'node:path';
import type { FuzzFormat } from './seeds';
import type { Outcome } from './targets';

const ROOT = join(import.meta.dirname, '../..');
/** Largest single allocation a mutant of a few kilobytes may cause (its seeds need well under 1 MiB). */
export const ALLOCATION_LIMIT = 64 * 1024 * 1024;
const OUTCOMES: Outcome[] = ['read', 'refused', 'crash', 'unlocated', 'allocation', 'hang'];

export interface Finding {
  format: FuzzFormat;
  index: number;
  outcome: Outcome;
  detail: string;
}

export interface FormatReport {
  format: FuzzFormat;
  counts: Record<Outcome, number>;
  seconds: number;
}

export interface CampaignOptions {
  formats: readonly FuzzFormat[];
  /** Mutants per format. */
  n: number;
  /** Index of the first mutant (default 0): --from i --n 1 reproduces mutant i alone. */
  from?: number;
  seed: number;
  /** Longest a single mutant may take, in ms. */
  timeBoundMs: number;
  /** Largest single allocation allowed while reading a mutant, in bytes. */
  allocationLimit: number;
  parallel?: number;
  onProgress?: (format: FuzzFormat, done: number) => void;
}

/**
 * CPU milliseconds a process has used (Linux /proc/<pid>/stat: utime + stime in clock ticks of
 * 1/100 s, the usual USER_HZ), or null where that cannot be read.
 */
function cpuMs(pid: number | undefined): number | null {
  if (pid === undefined) return null;
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(fields[11]) + Number(fields[12])) * 10;
  } catch {
    return null;
  }
}

/** Runs mutants from..to-1 in one child; resolves with the index to resume at (to, or after a hang). */
function runChild(format: FuzzFormat, from: number, to: number, o: CampaignOptions, report: FormatReport, findings: Finding[]): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', join(ROOT, 'test/fuzz/child.ts'), format, String(o.seed), String(from), String(to), String(o.allocationLimit)], { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
    let current = -1;
    let started = Date.now();
    let startedCpu: number | null = null;
    let hung = false;
    let stderr = '';
    child.stderr.on('data', (c) => (stderr = (stderr + String(c)).slice(-4000)));
    // A hang is a mutant that has used more than the bound in CPU time (a busy machine can stall a
    // process for seconds without it doing anything wrong), or six times the bound in wall time
    // (a wait that never ends). Where CPU time cannot be read, wall time is the measure.
    const watchdog = setInterval(() => {
      if (current < 0) return;
      const wall = Date.now() - started;
      const cpu = cpuMs(child.pid);
      const used = cpu !== null && startedCpu !== null ? cpu - startedCpu : wall;
      if (used > o.timeBoundMs || wall > 6 * o.timeBoundMs) {
        hung = true;
        child.kill('SIGKILL');
      }
    }, 50);
    const lines = createInterface({ input: child.stdout });
    lines.on('line', (line) => {
      if (line.startsWith('>')) {
        current = Number(line.slice(1));
        started = Date.now();
        startedCpu = cpuMs(child.pid);
      } else if (line.startsWith('=')) {
        const outcome = line.slice(line.indexOf(' ') + 1) as Outcome;
        report.counts[outcome] += 1;
        current = -1;
        o.onProgress?.(format, Number(line.slice(1, line.indexOf(' '))) + 1);
      } else if (line.startsWith('!')) {
        const [head, outcome] = line.split(' ', 2);
        findings.push({ format, index: Number(head.slice(1)), outcome: outcome as Outcome, detail: line.slice(head.length + outcome.length + 2) });
      }
    });
    child.on('exit', (code, signal) => {
      clearInterval(watchdog);
      lines.close();
      if (hung) {
        report.counts.hang += 1;
        findings.push({ format, index: current, outcome: 'hang', detail: `no end within ${o.timeBoundMs} ms of CPU time (or ${6 * o.timeBoundMs} ms of wall time)` });
        resolve(current + 1);
      } else if (code === 0) resolve(to);
      else if (current >= 0) {
        // The process died on this mutant (out of memory, a native crash): a finding, then go on.
        report.counts.crash += 1;
        findings.push({ format, index: current, outcome: 'crash', detail: `the reading process ended (${signal ?? `exit ${code}`}): ${stderr.trim().split('\n').filter(Boolean).slice(0, 12).join(' | ')}` });
        resolve(current + 1);
      } else reject(new Error(`fuzz child for ${format} failed outside a mutant (${signal ?? `exit ${code}`}): ${stderr.trim()}`));
    });
  });
}

async function runFormat(format: FuzzFormat, o: CampaignOptions, findings: Finding[]): Promise<FormatReport> {
  const report: FormatReport = { format, counts: Object.fromEntries(OUTCOMES.map((k) => [k, 0])) as Record<Outcome, number>, seconds: 0 };
  const t0 = Date.now();
  const end = (o.from ?? 0) + o.n;
  for (let at = o.from ?? 0; at < end;) at = await runChild(format, at, end, o, report, findings);
  report.seconds = (Date.now() - t0) / 1000;
  return report;
}

export async function runCampaign(o: CampaignOptions): Promise<{ reports: FormatReport[]; findings: Finding[] }> {
  const findings: Finding[] = [];
  const queue = [...o.formats];
  const reports: FormatReport[] = [];
  const worker = async () => {
    for (let f = queue.shift(); f !== undefined; f = queue.shift()) reports.push(await runFormat(f, o, findings));
  };
  await Promise.all(Array.from({ length: Math.max(1, o.parallel ?? 2) }, worker));
  reports.sort((a, b) => o.formats.indexOf(a.format) - o.formats.indexOf(b.format));
  return { reports, findings };
}

/** Counts as a text table, one row per format. */
export function formatReports(reports: FormatReport[]): string {
  const head = ['format', ...OUTCOMES, 'seconds'];
  const rows = reports.map((r) => [r.format, ...OUTCOMES.map((k) => String(r.counts[k])), r.seconds.toFixed(1)]);
  const widths = head.map((h, j) => Math.max(h.length, ...rows.map((r) => r[j].length)));
  return [head, ...rows].map((r) => r.map((c, j) => (j === 0 ? c.padEnd(widths[j]) : c.padStart(widths[j]))).join('  ')).join('\n');
}
