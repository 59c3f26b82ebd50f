// Suite "raw": random access into raw-signal files on disk. A 2 h, 6-channel, 50 Hz EDF (1 s records)
// and the same signal as a raw CSV are written to a temp folder; we time opening each file and
// reading a 10 s span from the middle through the Node file source (target for the EDF span read:
// under 20 ms). --quick: a 20 min file.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openFileSource } from '../../src/cli/file-source';
import { countingSource } from '../../src/core/raw/byte-source';
import { openRawCsv } from '../../src/core/raw/csv/read';
import { openEdf } from '../../src/core/raw/edf/read';
import { writeEdf } from '../../src/core/raw/edf/write';
import type { ByteSource } from '../../src/core/raw/byte-source';
import type { RawSource } from '../../src/core/raw/span.types';
import { measure } from '../measure';

const RATE = 50;
const CHANNELS = 6;

function signals(seconds: number): Float64Array[] {
  return Array.from({ length: CHANNELS }, (_, c) => Float64Array.from({ length: seconds * RATE }, (_, i) => Math.round(1e4 * Math.sin((2 * Math.PI * (c + 1) * i) / RATE)) / 1e4));
}

export async function run(quick: boolean): Promise<void> {
  const seconds = quick ? 1200 : 7200;
  const dir = mkdtempSync(join(tmpdir(), 'gleaner-bench-raw-'));
  try {
    const data = signals(seconds);
    const edfPath = join(dir, 'long.edf');
    writeFileSync(edfPath, writeEdf({
      patient: 'bench', recording: 'bench', start: { year: 2026, month: 3, day: 2, hour: 8, minute: 0, second: 0 }, recordDuration: 1, plus: true,
      signals: data.map((samples, c) => ({ label: `ch${c}`, unit: 'g', physMin: -4, physMax: 4, digMin: -32768, digMax: 32767, samplesPerRecord: RATE, samples })),
    }));
    const csvPath = join(dir, 'long.csv');
    const lines = ['time_s,ch0,ch1,ch2,ch3,ch4,ch5'];
    for (let i = 0; i < seconds * RATE; i++) lines.push(`${(1772438400 + i / RATE).toFixed(2)},${data.map((d) => d[i].toFixed(4)).join(',')}`);
    writeFileSync(csvPath, `${lines.join('\n')}\n`);

    const mid = seconds / 2;
    const rows: string[][] = [];
    const openers: [string, string, (s: ByteSource, name: string) => Promise<RawSource>][] = [['EDF+C', edfPath, openEdf], ['CSV', csvPath, openRawCsv]];
    for (const [kind, path, opener] of openers) {
      const file = await openFileSource(path);
      const counted = countingSource(file);
      const opened = await measure(() => opener(counted, path), 3);
      const source = opened.result;
      counted.reset();
      const span = await measure(() => source.readSpan(mid, mid + 10), 9);
      const perRead = counted.bytesRead / 10; // 1 warm-up + 9 timed reads
      rows.push([kind, `${(file.size / 2 ** 20).toFixed(1)} MiB`, `${opened.ms.toFixed(1)} ms`, `${span.ms.toFixed(2)} ms`, `${Math.round(perRead)} B`, `${span.result.channels[0].samples.length}`]);
      await file.close();
    }
    console.log(`raw: ${seconds / 60} min, ${CHANNELS} channels, ${RATE} Hz; 10 s span from the middle (target for EDF: < 20 ms)`);
    const head = ['file', 'size', 'open (index)', 'read 10 s', 'bytes read', 'samples/ch'];
    const widths = head.map((h, j) => Math.max(h.length, ...rows.map((r) => r[j].length)));
    for (const r of [head, ...rows]) console.log(r.map((c, j) => c.padEnd(widths[j])).join('  '));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
