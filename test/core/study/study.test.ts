import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/core/errors';
import { checkInputs } from '../../../src/core/study/check-inputs';
import { decodeStudy } from '../../../src/core/study/decode';
import { encodeStudy } from '../../../src/core/study/encode';
import { runCuration } from '../../../src/core/study/run-curation';
import { readZip, writeZip } from '../../../src/core/study/zip';
import { smallStudy } from './fixture';

describe('encodeStudy(study) / decodeStudy(bytes, fileName)', () => {
  it('round-trips a study exactly: typed arrays keep their type and values, NaN and Infinity survive', () => {
    const study = smallStudy();
    const back = decodeStudy(encodeStudy(study), 'a.gleaner');
    expect(back).toEqual(study);
    expect(back.runs[0].result.labels).toBeInstanceOf(Int32Array);
    expect(back.runs[0].result.coords).toBeInstanceOf(Float32Array);
    expect(back.runs[0].result.centroids).toBeInstanceOf(Float64Array);
    expect(Number.isNaN(back.runs[0].result.metrics.silhouette)).toBe(true);
    expect(back.view).toEqual({ colourBy: 'cluster', transform: { x: 0.5, y: -1, scale: Infinity } });
  });

  it('writes study.json first and one little-endian .bin entry per array, described by dtype and length', () => {
    const entries = readZip(encodeStudy(smallStudy()));
    expect(entries[0].name).toBe('study.json');
    const names = entries.map((e) => e.name);
    expect(names).toContain('arrays/run-1/result.labels.bin');
    expect(names).toContain('arrays/run-1/curation.actions.2.parts.bin');
    const labels = entries.find((e) => e.name === 'arrays/run-1/result.labels.bin')!.data;
    // Int32 1 written little-endian is 01 00 00 00 (common practice for little-endian layout).
    expect(Array.from(labels.subarray(8, 12))).toEqual([1, 0, 0, 0]);
    const json = JSON.parse(new TextDecoder().decode(entries[0].data));
    expect(json.runs[0].result.labels).toEqual({ $array: 'arrays/run-1/result.labels.bin', dtype: 'int32', length: 6 });
    expect(json.runs[0].result.metrics.silhouette).toEqual({ $number: 'NaN' });
  });

  it('gives the same bytes for the same study', () => {
    expect(encodeStudy(smallStudy())).toEqual(encodeStudy(smallStudy()));
  });

  it('replays the recorded curation on reopening', () => {
    const state = runCuration(decodeStudy(encodeStudy(smallStudy()), 'a.gleaner').runs[0]);
    // promote 0; move window 5 to 0; split cluster 1 (windows 2, 3) into parts 0, 1 → window 3 to new cluster 2.
    expect(Array.from(state.labels)).toEqual([0, 0, 1, 2, 0, 0]);
    expect(state.clusters.map((c) => c.className)).toEqual(['walking', '', '']);
  });

  it('names the file and what was wrong for a damaged or foreign file', () => {
    const bytes = encodeStudy(smallStudy());
    const cut = bytes.slice(0, bytes.length - 30);
    expect(() => decodeStudy(cut, 'a.gleaner')).toThrow(InputError);
    expect(() => decodeStudy(cut, 'a.gleaner')).toThrow(/^a\.gleaner: expected a Gleaner study \(a ZIP archive\)/);
    const noJson = writeZip([{ name: 'other.txt', data: new Uint8Array(1) }]);
    expect(() => decodeStudy(noJson, 'b.gleaner')).toThrow(/b\.gleaner: expected a Gleaner study with study\.json inside/);
    const missing = readZip(bytes).filter((e) => e.name !== 'arrays/run-1/result.labels.bin');
    expect(() => decodeStudy(writeZip(missing), 'c.gleaner')).toThrow(/the entry arrays\/run-1\/result\.labels\.bin named in study\.json/);
  });

  it('refuses a study from a newer schema version with a clear message', () => {
    const doc = { schemaVersion: 7, inputs: [], runs: [] };
    const bytes = writeZip([{ name: 'study.json', data: new TextEncoder().encode(JSON.stringify(doc)) }]);
    expect(() => decodeStudy(bytes, 'new.gleaner')).toThrow(/new\.gleaner: expected study\.json: schemaVersion 0 or 1 .*found 7/);
  });
});

describe('migrateStudy (through decodeStudy): a hand-made version 0 document', () => {
  it('becomes version 1: inputs list, run ids, class names as promote actions', () => {
    const v0 = {
      version: 0,
      input: { fileName: 'w.csv', sha256: 'cd'.repeat(32), rows: 3 },
      runs: [{
        params: { k: 2, seed: 1 },
        roles: [],
        names: ['resting', '', 'typing'],
        result: {
          cluster: { k: 3 },
          labels: { $array: 'arrays/0/labels.bin', dtype: 'int32', length: 3 },
          confidence: { $array: 'arrays/0/confidence.bin', dtype: 'float32', length: 3 },
        },
      }],
    };
    const bytes = writeZip([
      { name: 'study.json', data: new TextEncoder().encode(JSON.stringify(v0)) },
      { name: 'arrays/0/labels.bin', data: new Uint8Array(Int32Array.from([2, 0, 1]).buffer) },
      { name: 'arrays/0/confidence.bin', data: new Uint8Array(Float32Array.from([1, 0.5, 0.25]).buffer) },
    ]);
    const study = decodeStudy(bytes, 'old.gleaner');
    expect(study.schemaVersion).toBe(1);
    expect(study.inputs).toEqual([{ fileName: 'w.csv', path: 'w.csv', sha256: 'cd'.repeat(32), rows: 3 }]);
    expect(study.runs[0].id).toBe('run-1');
    expect(study.runs[0].curation.actions).toEqual([
      { type: 'promote', cluster: 0, className: 'resting' },
      { type: 'promote', cluster: 2, className: 'typing' },
    ]);
    expect(Array.from(study.runs[0].result.labels)).toEqual([2, 0, 1]);
    expect(runCuration(study.runs[0]).clusters.map((c) => c.className)).toEqual(['resting', '', 'typing']);
  });
});

describe('checkInputs(study, hashes)', () => {
  it('reports unchanged, changed and missing inputs', () => {
    const study = smallStudy();
    study.inputs.push({ fileName: 'x.csv', path: '/x.csv', sha256: '00'.repeat(32), rows: 1 }, { fileName: 'y.csv', path: '/y.csv', sha256: '11'.repeat(32), rows: 1 });
    const report = checkInputs(study, ['AB'.repeat(32), 'ff'.repeat(32), undefined]);
    expect(report.map((r) => r.status)).toEqual(['same', 'changed', 'missing']);
    expect(report[1].message).toMatch(/^x\.csv: changed since the study was saved/);
    expect(report[2].message).toBe('y.csv: not found at /y.csv');
  });
});

describe('encodeStudy: array entry names', () => {
  it('keeps two arrays whose keys differ only in characters left out of entry names apart', () => {
    const study = smallStudy();
    study.view = { 'a b': Int32Array.from([1]), 'a/b': Int32Array.from([2]) };
    const back = decodeStudy(encodeStudy(study), 's.gleaner');
    expect(back.view).toEqual(study.view);
    expect(readZip(encodeStudy(study)).map((e) => e.name).filter((n) => n.startsWith('arrays/study/'))).toEqual(['arrays/study/view.a_b.bin', 'arrays/study/view.a_b~2.bin']);
  });
});
