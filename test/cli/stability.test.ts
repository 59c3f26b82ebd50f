import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli, tempDir } from './run-cli';

// gleaner analyze --stability <B> on the demo study (demo-data/windows.csv: 12 volunteers).
interface StabilitySummary {
  stabilityRule: { resamples: number; leaveOutShare: number; subjectsLeftOut: number; subjects: number; seed: number; dissolution: number; text: string };
  clusters: {
    id: number; size: number; subjectBound: boolean; stability: number;
    stabilityDetail: { dissolvedShare: number; dissolvingSubjects: { subject: string; leftOut: number; dissolved: number; share: number }[] };
  }[];
}

describe('gleaner analyze --stability', () => {
  it('adds each cluster\'s stability and its detail to summary.json, the same bytes for the same seed', () => {
    const outs = [tempDir('stability-a'), tempDir('stability-b')];
    for (const out of outs) {
      const r = runCli(['analyze', 'demo-data/windows.csv', '--k', '7', '--seed', '1', '--stability', '4', '--progress', 'none', '--out', out]);
      expect(r.stderr).toBe('');
      expect(r.status).toBe(0);
    }
    const [a, b] = outs.map((o) => readFileSync(join(o, 'summary.json'), 'utf8'));
    expect(b).toBe(a);
    const s = JSON.parse(a) as StabilitySummary;
    expect(s.stabilityRule).toMatchObject({ resamples: 4, leaveOutShare: 0.25, subjectsLeftOut: 3, subjects: 12, seed: 1, dissolution: 0.5 });
    expect(s.stabilityRule.text).toContain('leaving out 3 of 12 subjects');
    expect(s.clusters).toHaveLength(7);
    for (const c of s.clusters) {
      expect(c.stability).toBeGreaterThanOrEqual(0);
      expect(c.stability).toBeLessThanOrEqual(1);
      // With 4 resamples the dissolved share is a count of quarters.
      expect(Number.isInteger(c.stabilityDetail.dissolvedShare * 4)).toBe(true);
      for (const d of c.stabilityDetail.dissolvingSubjects) {
        expect(d.share).toBeGreaterThan(c.stabilityDetail.dissolvedShare);
        expect(d.dissolved).toBeLessThanOrEqual(d.leftOut);
        expect(d.subject).toMatch(/^S\d\d$/);
      }
    }
  });

  it('leaves summary.json without stability when not asked', () => {
    const out = tempDir('stability-none');
    const r = runCli(['analyze', 'demo-data/windows.csv', '--k', '7', '--progress', 'none', '--out', out]);
    expect(r.status).toBe(0);
    const s = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8')) as Record<string, unknown> & { clusters: Record<string, unknown>[] };
    expect(s.stabilityRule).toBeUndefined();
    for (const c of s.clusters) expect(c.stability).toBeUndefined();
  });

  it('refuses a table without a subject column before the run, and a bad B', () => {
    const dir = tempDir('stability-bad');
    const csv = join(dir, 'plain.csv');
    writeFileSync(csv, `a,b\n${Array.from({ length: 30 }, (_, i) => `${i % 3},${(i * 7) % 5}`).join('\n')}\n`);
    const r = runCli(['analyze', csv, '--k', '2', '--stability', '5', '--progress', 'none', '--out', join(dir, 'out')]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--stability.*subject column/);
    const bad = runCli(['analyze', csv, '--stability', 'many', '--out', join(dir, 'out')]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('invalid --stability: "many"');
  });
});
