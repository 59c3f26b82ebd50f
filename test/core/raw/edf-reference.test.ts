// Reads the EDF+ files pyedflib's test suite ships, kept in test/fixtures/edf; SOURCE.md there names
// the source of each expected value (pyedflib's tests, the EDF and EDF+ specifications, or computed).
import { describe, expect, it } from 'vitest';
import { bytesSource } from '../../../src/core/raw/byte-source';
import { isoFromEpoch } from '../../../src/core/raw/civil-time';
import { openEdf } from '../../../src/core/raw/edf/read';
import { referenceBytes } from './reference-edf';

const open = (name: string) => openEdf(bytesSource(referenceBytes(name)), name);

describe('openEdf on reference files (test/fixtures/edf)', () => {
  it('test_generator.edf: header fields (pyedflib test_edfreader.py; EDF/EDF+ header layout)', async () => {
    const edf = await open('test_generator.edf');
    const h = edf.header;
    expect(h.format).toBe('EDF+C');
    expect(h.headerBytes).toBe(3328);
    expect(h.records).toBe(600);
    expect(h.recordDuration).toBe(1);
    expect(h.signals).toHaveLength(12);
    expect(h.signals.filter((s) => s.annotation).map((s) => s.label)).toEqual(['EDF Annotations']);
    expect(h.start).toEqual({ year: 2011, month: 4, day: 4, hour: 12, minute: 57, second: 2 });
    expect(h.patient).toBe('abcxyz99 M 30-JUN-1969 Hans_Muller patient');
    const s0 = h.signals[0];
    expect([s0.label, s0.transducer, s0.unit, s0.physMin, s0.physMax, s0.digMin, s0.digMax, s0.prefilter, s0.samplesPerRecord])
      .toEqual(['squarewave', 'trans1', 'uV', -1000, 1000, -32768, 32767, 'pre1', 200]);
    expect(edf.channels[0].rate).toBe(200);
  });

  it('test_generator.edf: 120,000 samples per signal, and the first squarewave sample scales to 99.99237 uV', async () => {
    const edf = await open('test_generator.edf');
    const span = await edf.readSpan(0, 600);
    expect(span.channels).toHaveLength(11);
    for (const c of span.channels) expect(c.samples.length).toBe(120000);
    // EDF scaling rule: digital 3276 -> -1000 + (3276 + 32768) * 2000 / 65535 = 99.99237 (computed).
    expect(span.channels[0].samples[0]).toBeCloseTo(99.99237, 4);
    expect(span.channels[0].t0).toBe(0);
  });

  it('test_generator.edf: annotations "Recording starts" at 0 s and "Recording ends" at 600 s', async () => {
    const edf = await open('test_generator.edf');
    const texts = (await edf.annotations()).map((a) => [a.onset, a.text]);
    expect(texts).toEqual([[0, 'Recording starts'], [600, 'Recording ends']]);
  });

  it('test_subsecond.edf: the first time-keeping TAL "+0.3945312" gives the start 2020-01-24 04:05:56.394531', async () => {
    const edf = await open('test_subsecond.edf');
    expect(edf.recordOnsets[0]).toBe(0.3945312);
    expect(isoFromEpoch(edf.startEpoch! + edf.recordOnsets[0])).toBe('2020-01-24T04:05:56.394531Z');
    expect(edf.coverage[0].start).toBe(0.3945312);
    const span = await edf.readSpan(0, 1);
    expect(span.channels[0].t0).toBe(0.3945312);
  });

  it('test_utf8.edf: the third annotation reads "中文测试八个字" (UTF-8)', async () => {
    const edf = await open('test_utf8.edf');
    const a = await edf.annotations();
    expect(a[2].text).toBe('中文测试八个字');
  });
});
