/**
 * Golden outputs: the files a command or an export wrote, kept under test/fixtures/golden/<case>/.
 * Every file is listed with its size and SHA-256 in sha256.json (so a change of any byte fails);
 * files up to 64 KiB are also kept in full, so a failing comparison shows a readable difference.
 * Set GLEANER_GOLDEN_WRITE=1 to write the fixtures instead of comparing (then review the diff).
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

export const GOLDEN_ROOT = resolve(import.meta.dirname, '../fixtures/golden');
export const WRITE_GOLDEN = process.env.GLEANER_GOLDEN_WRITE === '1';
const FULL_LIMIT = 64 * 1024;

export type Outputs = Map<string, Buffer>;

interface Listed {
  bytes: number;
  sha256: string;
}

function sha256(b: Buffer): string {
  return createHash('sha256').update(b).digest('hex');
}

/** Every file under `dir` (recursively), by path relative to it with '/' separators, sorted. */
export function readOutputs(dir: string, prefix = ''): Outputs {
  const out: Outputs = new Map();
  for (const entry of readdirSync(dir, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : 1))) {
    const rel = prefix ? `${prefix}/${entry.name}` : entry.name;
    if (entry.isDirectory()) for (const [k, v] of readOutputs(join(dir, entry.name), rel)) out.set(k, v);
    else out.set(rel, readFileSync(join(dir, entry.name)));
  }
  return out;
}

/** Replaces every occurrence of each `from` string in a text file's bytes by `to`. */
export function maskText(data: Buffer, replacements: readonly [from: string | RegExp, to: string][]): Buffer {
  let text = data.toString('utf8');
  for (const [from, to] of replacements) text = typeof from === 'string' ? text.split(from).join(to) : text.replace(from, to);
  return Buffer.from(text, 'utf8');
}

/**
 * Writes (GLEANER_GOLDEN_WRITE=1) or checks the outputs of one case. Returns the problems found
 * (empty when every file is byte-identical to the golden one and no file is missing or extra).
 */
export function checkGolden(name: string, outputs: Outputs): string[] {
  const dir = join(GOLDEN_ROOT, name);
  const sorted = new Map([...outputs].sort(([a], [b]) => (a < b ? -1 : 1)));
  if (WRITE_GOLDEN) {
    rmSync(dir, { recursive: true, force: true });
    mkdirSync(dir, { recursive: true });
    const listing: Record<string, Listed> = {};
    for (const [file, data] of sorted) {
      listing[file] = { bytes: data.length, sha256: sha256(data) };
      if (data.length <= FULL_LIMIT) {
        const path = join(dir, 'files', file);
        mkdirSync(resolve(path, '..'), { recursive: true });
        writeFileSync(path, data);
      }
    }
    writeFileSync(join(dir, 'sha256.json'), `${JSON.stringify(listing, null, 1)}\n`);
    return [];
  }
  if (!existsSync(join(dir, 'sha256.json'))) return [`no golden outputs for "${name}" (run with GLEANER_GOLDEN_WRITE=1)`];
  const listing = JSON.parse(readFileSync(join(dir, 'sha256.json'), 'utf8')) as Record<string, Listed>;
  const problems: string[] = [];
  const want = Object.keys(listing);
  const got = [...sorted.keys()];
  for (const f of want) if (!sorted.has(f)) problems.push(`${name}: missing ${f}`);
  for (const f of got) if (!(f in listing)) problems.push(`${name}: unexpected ${f}`);
  for (const [file, data] of sorted) {
    const expected = listing[file];
    if (!expected) continue;
    if (expected.bytes === data.length && expected.sha256 === sha256(data)) continue;
    const full = join(dir, 'files', file);
    let detail = `${data.length} bytes (golden ${expected.bytes})`;
    if (existsSync(full)) {
      const a = readFileSync(full, 'utf8').split('\n');
      const b = data.toString('utf8').split('\n');
      const line = a.findIndex((l, i) => l !== b[i]);
      const at = line < 0 ? a.length : line;
      detail += `; first difference on line ${at + 1}: golden ${JSON.stringify(a[at]?.slice(0, 160))}, now ${JSON.stringify(b[at]?.slice(0, 160))}`;
    }
    problems.push(`${name}: ${file} differs: ${detail}`);
  }
  return problems;
}
