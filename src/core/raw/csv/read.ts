import { InputError } from '../../errors';
import type { ByteSource } from '../byte-source';
import { gridLength, pickChannels } from '../pick-channels';
import type { RawChannelInfo, RawSource, RawSpan } from '../span.types';
import { indexRawCsv, type RawCsvIndex } from './csv-index';
import { parseTime } from './time-value';

export interface RawCsvFile extends RawSource {
  kind: 'csv';
  index: RawCsvIndex;
}

const UNIT = /^(.*?)\s*[[(]([^\])]*)[\])]\s*$/;

/** Opens a raw-signal CSV: one pass builds the index; spans then read only the rows that cover them. */
export async function openRawCsv(source: ByteSource, fileName: string): Promise<RawCsvFile> {
  const index = await indexRawCsv(source, fileName);
  const channelColumns = index.columns.map((_, j) => j).filter((j) => j !== index.timeColumn);
  const channels: RawChannelInfo[] = channelColumns.map((j) => {
    const m = UNIT.exec(index.columns[j]);
    return { label: index.columns[j], unit: m ? m[2] : '', rate: index.rate };
  });
  return {
    kind: 'csv', fileName, index, channels, startEpoch: index.startEpoch, coverage: index.coverage,
    async readSpan(start: number, end: number, chosen?: readonly (string | number)[]): Promise<RawSpan> {
      const picked = pickChannels(channels, chosen);
      const { offsets, times, rate } = index;
      // Index entries bracketing [start, end): the last at or before start, the first at or after end.
      let a = 0;
      while (a + 1 < times.length && times[a + 1] <= start) a++;
      let b = a;
      while (b < times.length && times[b] < end) b++;
      const from = offsets[a];
      const to = b < offsets.length ? offsets[b] : index.end;
      const text = new TextDecoder('utf-8').decode(await source.read(from, to - from));
      const lines = text.split('\n');
      const rowTimes: number[] = [];
      const rowCells: string[][] = [];
      lines.forEach((line, k) => {
        const l = line.endsWith('\r') ? line.slice(0, -1) : line;
        if (l === '') return;
        const cells = l.split(index.delimiter);
        const t = Math.round((parseTime(cells[index.timeColumn].trim(), index.timeFormat) - index.origin) * 1e6) / 1e6;
        if (Number.isNaN(t)) {
          throw new InputError({ file: fileName, column: index.columns[index.timeColumn], expected: 'a time like the indexed rows (the file changed after it was opened?)', found: `${cells[index.timeColumn]} on line ${k + 1} of the span` });
        }
        if (t >= start && t < end) {
          rowTimes.push(t);
          rowCells.push(cells);
        }
      });
      const t0 = rowTimes.length ? rowTimes[0] : start;
      const n = rowTimes.length ? gridLength(t0, Math.min(end, rowTimes[rowTimes.length - 1] + 1 / rate), rate) : 0;
      return {
        channels: picked.map((i) => {
          const col = channelColumns[i];
          const samples = new Float32Array(n).fill(NaN);
          rowTimes.forEach((t, r) => {
            const j = Math.round((t - t0) * rate);
            const cell = rowCells[r][col];
            if (j >= 0 && j < n && cell !== undefined && cell.trim() !== '') samples[j] = Number(cell);
          });
          return { ...channels[i], t0, samples };
        }),
      };
    },
  };
}
