import { STUDY_SCHEMA_VERSION } from './study.types';

/**
 * Brings a parsed study.json (typed arrays still as {"$array"} references) to the current schema.
 * Version 0 (the first drafts, one input and class names per run) becomes version 1: `input` →
 * `inputs[0]`, each run gets an id, `input: 0`, and its `names` become promote actions. Throws an
 * Error saying what was expected; the caller adds the file name.
 */
export function migrateStudy(json: unknown): Record<string, unknown> {
  if (json === null || typeof json !== 'object' || Array.isArray(json)) throw new Error('a JSON object at the top of study.json');
  let doc = json as Record<string, unknown>;
  const version = doc.schemaVersion ?? doc.version;
  if (version === 0) doc = fromVersion0(doc);
  else if (version !== STUDY_SCHEMA_VERSION) {
    throw new Error(`schemaVersion 0 or ${STUDY_SCHEMA_VERSION} (this Gleaner reads up to ${STUDY_SCHEMA_VERSION}; a newer file needs a newer Gleaner), found ${JSON.stringify(version)}`);
  }
  return doc;
}

function fromVersion0(v0: Record<string, unknown>): Record<string, unknown> {
  const input = v0.input as Record<string, unknown> | undefined;
  if (!input || typeof input !== 'object') throw new Error('an "input" object in a version 0 study');
  const runs = Array.isArray(v0.runs) ? (v0.runs as Record<string, unknown>[]) : [];
  return {
    schemaVersion: STUDY_SCHEMA_VERSION,
    app: v0.app ?? { name: 'Gleaner', version: 'unknown' },
    inputs: [{ fileName: input.fileName, path: input.path ?? input.fileName, sha256: input.sha256, rows: input.rows ?? 0 }],
    runs: runs.map((r, i) => {
      const names = Array.isArray(r.names) ? (r.names as unknown[]) : [];
      const actions = names.flatMap((name, cluster) => (typeof name === 'string' && name.trim() !== '' ? [{ type: 'promote', cluster, className: name }] : []));
      return {
        id: `run-${i + 1}`,
        input: 0,
        roles: r.roles ?? [],
        params: r.params ?? {},
        result: r.result,
        curation: { actions, undone: [] },
        flags: [],
        createdAt: r.createdAt ?? '',
      };
    }),
    activeRun: runs.length - 1,
    notes: typeof v0.notes === 'string' ? v0.notes : '',
    view: {},
  };
}
