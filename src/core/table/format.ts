import { OptionError } from '../errors';
import { TABLE_FORMATS, type TableFormat } from './reader.types';

const EXTENSIONS: [RegExp, TableFormat][] = [
  [/\.(csv|tsv|tab|txt)$/i, 'csv'],
  [/\.(parquet|parq|pq)$/i, 'parquet'],
  [/\.(arrow|feather|ipc|arrows)$/i, 'arrow'],
];

/**
 * The format of a file from its first bytes ("PAR1" = Parquet, "ARROW1" = Arrow IPC file, an IPC
 * stream's 0xFFFFFFFF continuation marker = Arrow), else from its extension, else text.
 */
export function detectFormat(fileName: string, head: Uint8Array): TableFormat {
  const magic = String.fromCharCode(...head.subarray(0, 6));
  if (magic.startsWith('PAR1')) return 'parquet';
  if (magic === 'ARROW1') return 'arrow';
  if (head.length >= 4 && head[0] === 0xff && head[1] === 0xff && head[2] === 0xff && head[3] === 0xff) return 'arrow';
  for (const [re, format] of EXTENSIONS) if (re.test(fileName)) return format;
  return 'csv';
}

/** Validates a format name given by a user or a job payload. */
export function tableFormat(value: unknown): TableFormat {
  if (typeof value === 'string' && (TABLE_FORMATS as readonly string[]).includes(value)) return value as TableFormat;
  throw new OptionError('format', value, `one of ${TABLE_FORMATS.join(', ')}`);
}
