import { describe, expect, it } from 'vitest';
import { EtaEstimator, ETA_DEFAULTS } from '../../../src/core/progress/eta';
import { seededRandom } from '../../../src/core/random';

/** One progress report as a job host sends it: time (ms since start), fraction of the job, stage. */
interface Report { t: number; f: number; stage: string }

/**
 * Replays reports into an estimator and asks it once a second (as the app's ticker does) and after
 * every report: what it showed, and when. Returns [time, shown ETA or null] pairs.
 */
function replay(reports: Report[], endAt: number): Array<[number, number | null]> {
  const eta = new EtaEstimator(0);
  const shown: Array<[number, number | null]> = [];
  let next = 0;
  for (let t = 0; t < endAt; t += 100) {
    while (next < reports.length && reports[next].t <= t) {
      const r = reports[next++];
      eta.report(r.t, r.f, r.stage);
    }
    if (t % 1000 === 0) shown.push([t, eta.at(t)]);
  }
  return shown;
}

/** Reports every ~100 ms (jittered by ±40 ms, seeded) of a fraction given as a function of time. */
function sequence(end: number, fractionAt: (t: number) => number, stageAt: (t: number) => string = () => 'embedding', seed = 7): Report[] {
  const random = seededRandom(seed);
  const out: Report[] = [];
  for (let t = 100; t < end; t += 100) {
    const at = t + (random() - 0.5) * 80;
    out.push({ t: at, f: fractionAt(at), stage: stageAt(at) });
  }
  return out;
}

const within = (eta: number, trueLeft: number, share: number) => Math.abs(eta - trueLeft) <= share * trueLeft;

describe('EtaEstimator', () => {
  it('steady: hidden for the first seconds, then shown, each shown ETA within ±30% of the true time left', () => {
    const END = 60_000;
    const shown = replay(sequence(END, (t) => t / END), END);
    const first = shown.find(([, e]) => e !== null);
    expect(first).toBeDefined();
    expect(first![0]).toBeGreaterThanOrEqual(ETA_DEFAULTS.minElapsedMs);
    expect(first![0]).toBeLessThanOrEqual(10_000);
    for (const [t, e] of shown) {
      if (t < ETA_DEFAULTS.minElapsedMs) expect(e).toBeNull();
      if (e !== null) expect(within(e, END - t, 0.3), `at ${t} ms: ETA ${e} ms, true ${END - t} ms`).toBe(true);
    }
    // Once shown on a steady job it stays shown until the last seconds.
    expect(shown.filter(([t, e]) => t >= 10_000 && t < END - 2000 && e === null)).toEqual([]);
  });

  it('steady with uneven steps (bursts of work, then pauses of up to 1 s): shown ETAs stay within ±30%', () => {
    const END = 90_000;
    // Work lands in bursts: the fraction moves in steps every 1 s, by uneven amounts that average out.
    const random = seededRandom(3);
    const steps: number[] = [];
    for (let s = 0; s < END / 1000; s++) steps.push(0.5 + random());
    const total = steps.reduce((a, b) => a + b, 0);
    const cum = [0];
    for (const s of steps) cum.push(cum[cum.length - 1] + s / total);
    const shown = replay(sequence(END, (t) => cum[Math.min(cum.length - 1, Math.floor(t / 1000))]), END);
    const visible = shown.filter(([, e]) => e !== null);
    expect(visible.length).toBeGreaterThan(30);
    // In the last 5 s one step (up to 1.5× the mean one) is over 30% of what is left: there ±1.5 s is the most a step-wise job can claim.
    for (const [t, e] of visible) {
      const left = END - t;
      expect(left < 5000 ? Math.abs(e! - left) <= 1500 : within(e!, left, 0.3), `at ${t} ms: ETA ${e} ms, true ${left} ms`).toBe(true);
    }
  });

  it('stalled: hidden from a few seconds into the stall until the job moves again and estimates agree', () => {
    // 40% in 20 s, no progress for 60 s (reports keep coming with the same fraction), then on at the old rate.
    const f = (t: number) => (t < 20_000 ? (t / 20_000) * 0.4 : t < 80_000 ? 0.4 : 0.4 + ((t - 80_000) / 30_000) * 0.6);
    const shown = replay(sequence(110_000, f), 110_000);
    expect(shown.some(([t, e]) => t < 20_000 && e !== null)).toBe(true);
    for (const [t, e] of shown) {
      if (t >= 20_000 + ETA_DEFAULTS.stallMs + 1000 && t < 80_000) expect(e, `at ${t} ms`).toBeNull();
    }
    // After the stall the rate window still holds the stall, so estimates disagree for a while;
    // the first ETA shown after it is within ±30% of the truth.
    const after = shown.filter(([t, e]) => t >= 80_000 && e !== null);
    expect(after.length).toBeGreaterThan(0);
    const [t0, e0] = after[0];
    expect(within(e0!, 110_000 - t0, 0.3), `at ${t0} ms: ETA ${e0} ms, true ${110_000 - t0} ms`).toBe(true);
  });

  it('stalled with no reports at all: the ticker alone hides the ETA', () => {
    const reports = sequence(20_000, (t) => t / 60_000);
    const eta = new EtaEstimator(0);
    for (const r of reports) eta.report(r.t, r.f, r.stage);
    expect(eta.at(20_000)).not.toBeNull();
    expect(eta.at(20_000 + ETA_DEFAULTS.stallMs + 1)).toBeNull();
  });

  it('accelerating: an estimate that keeps shrinking faster than time passes is hidden; what is shown is within ±30%', () => {
    // The fraction grows as the square of time: the rate keeps rising, so each window's rate is too low.
    const END = 100_000;
    const shown = replay(sequence(END, (t) => (t / END) ** 2), END);
    for (const [t, e] of shown) if (e !== null) expect(within(e, END - t, 0.3), `at ${t} ms: ETA ${e} ms, true ${END - t} ms`).toBe(true);
    // For the first half the estimated end falls by over a second per second: nothing is shown.
    expect(shown.filter(([t, e]) => t < 50_000 && e !== null)).toEqual([]);
    expect(shown.some(([, e]) => e !== null)).toBe(true);
  });

  it('stage changes: hidden after each change until the new stage has its own agreeing estimates', () => {
    // scaling (fast, 2 s), embedding (slow, 40 s for 60% of the bar), placing (8 s for 30%), clustering (10 s for 8%).
    const plan = [
      { stage: 'scaling', from: 0, to: 2000, f0: 0, f1: 0.02 },
      { stage: 'embedding', from: 2000, to: 42_000, f0: 0.02, f1: 0.62 },
      { stage: 'placing', from: 42_000, to: 50_000, f0: 0.62, f1: 0.92 },
      { stage: 'clustering', from: 50_000, to: 60_000, f0: 0.92, f1: 1 },
    ];
    const at = (t: number) => plan.find((p) => t < p.to) ?? plan[plan.length - 1];
    const reports = sequence(60_000, (t) => { const p = at(t); return p.f0 + ((Math.min(t, p.to) - p.from) / (p.to - p.from)) * (p.f1 - p.f0); }, (t) => at(t).stage);
    const shown = replay(reports, 60_000);
    const quiet = ETA_DEFAULTS.minWindowMs + ETA_DEFAULTS.agreeMs;
    for (const p of plan) {
      for (const [t, e] of shown) if (t > p.from + 100 && t < p.from + quiet) expect(e, `${p.stage} at ${t} ms`).toBeNull();
    }
    // Within the long embedding stage an ETA appears (it assumes the stage's own rate for the rest,
    // which overshoots here: the ETA is a stage-rate figure, not a promise across stages).
    expect(shown.some(([t, e]) => t >= 2000 && t < 42_000 && e !== null)).toBe(true);
    // In the last stage the rate holds to the end: shown figures there are within ±30%.
    for (const [t, e] of shown) if (t > 50_100 && e !== null) expect(within(e, 60_000 - t, 0.3), `at ${t} ms`).toBe(true);
  });

  it('a caller reporting every millisecond (an in-process kernel) gets the same steady answer', () => {
    const END = 40_000;
    const eta = new EtaEstimator(0);
    for (let t = 1; t < 30_000; t++) eta.report(t, t / END, 'clustering');
    const e = eta.at(30_000);
    expect(e).not.toBeNull();
    expect(within(e!, 10_000, 0.3)).toBe(true);
  });

  it('a finished job shows no ETA', () => {
    const eta = new EtaEstimator(0);
    for (let t = 100; t <= 20_000; t += 100) eta.report(t, t / 20_000, 'embedding');
    expect(eta.at(20_000)).toBeNull();
  });
});
