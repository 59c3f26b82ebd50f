import { OptionError } from '../errors';
import type { Recipe, RecipeStep, RecipeStepType } from './recipe.types';

type Fields = Record<string, unknown>;

/** Every step type with its defaults; `parseRecipe` fills what a step leaves out. */
const DEFAULTS: { [T in RecipeStepType]: Omit<Extract<RecipeStep, { type: T }>, 'type'> } = {
  'drop-missing': { axis: 'features', threshold: 0.5 },
  impute: { method: 'median', scope: 'global' },
  zscore: {},
  'subject-zscore': {},
  robust: { quantileRange: [25, 75] },
  minmax: {},
  log: { mode: 'signed-log', features: [] },
  'prune-constant': { minVariance: 0, maxModeShare: 0.95 },
  'prune-correlated': { threshold: 0.95 },
  clip: { lower: 1, upper: 99 },
};

export const STEP_TYPES = Object.keys(DEFAULTS) as RecipeStepType[];

/**
 * Validates a recipe read from JSON (a file, a study, a job payload) and fills defaults. Throws
 * OptionError naming the step index (1-based) and the field, e.g.
 * `invalid recipe step 2 (clip) lower: 120 (expected a percentile from 0 to 100)`.
 */
export function parseRecipe(json: unknown): Recipe {
  if (!isObject(json)) throw new OptionError('recipe', json, 'an object { "version": 1, "steps": [...] }');
  if (json.version !== 1) throw new OptionError('recipe version', json.version, '1');
  if (!Array.isArray(json.steps)) throw new OptionError('recipe steps', json.steps, 'a list of steps');
  for (const key of Object.keys(json)) {
    if (key !== 'version' && key !== 'steps') throw new OptionError(`recipe field "${key}"`, json[key], 'only "version" and "steps"');
  }
  return { version: 1, steps: json.steps.map((s, i) => parseStep(s, i)) };
}

/** Validates one step (index is 0-based; messages count from 1). */
export function parseStep(json: unknown, index: number): RecipeStep {
  const where = `recipe step ${index + 1}`;
  if (!isObject(json)) throw new OptionError(where, json, 'an object with a "type"');
  const type = json.type;
  if (typeof type !== 'string' || !(STEP_TYPES as string[]).includes(type)) {
    throw new OptionError(`${where} type`, type, `one of ${STEP_TYPES.join(', ')}`);
  }
  const t = type as RecipeStepType;
  const defaults = DEFAULTS[t] as Fields;
  for (const key of Object.keys(json)) {
    if (key !== 'type' && !(key in defaults)) {
      const known = Object.keys(defaults);
      throw new OptionError(`${where} (${t}) field "${key}"`, json[key], known.length ? `one of ${known.join(', ')}` : 'no fields for this step');
    }
  }
  const step = { type: t, ...structuredCloneFields(defaults), ...json } as Fields;
  const bad = (field: string, expected: string): never => {
    throw new OptionError(`${where} (${t}) ${field}`, step[field], expected);
  };
  const oneOf = (field: string, allowed: string[]) => {
    if (!allowed.includes(step[field] as string)) bad(field, `one of ${allowed.join(', ')}`);
  };
  const number = (field: string, lo: number, hi: number, expected: string, openHi = false) => {
    const v = step[field];
    if (typeof v !== 'number' || !Number.isFinite(v) || v < lo || v > hi || (openHi && v === hi)) bad(field, expected);
  };
  switch (t) {
    case 'drop-missing':
      oneOf('axis', ['windows', 'features']);
      number('threshold', 0, 1, 'a share from 0 (drop any missing) up to, not including, 1', true);
      break;
    case 'impute':
      oneOf('method', ['mean', 'median']);
      oneOf('scope', ['global', 'subject']);
      break;
    case 'robust': {
      const r = step.quantileRange;
      const ok = Array.isArray(r) && r.length === 2 && r.every((v) => typeof v === 'number' && Number.isFinite(v) && v >= 0 && v <= 100) && r[0] < r[1];
      if (!ok) bad('quantileRange', 'two percentiles [low, high] with 0 <= low < high <= 100');
      break;
    }
    case 'log': {
      oneOf('mode', ['log1p', 'signed-log']);
      const f = step.features;
      if (!Array.isArray(f) || !f.every((x) => typeof x === 'string' && x !== '')) bad('features', 'a list of feature names ([] for every feature)');
      break;
    }
    case 'prune-constant':
      number('minVariance', 0, Infinity, 'a variance >= 0');
      number('maxModeShare', 0, 1, 'a share above 0 and at most 1');
      if (step.maxModeShare === 0) bad('maxModeShare', 'a share above 0 and at most 1');
      break;
    case 'prune-correlated':
      number('threshold', 0, 1, 'a |r| from 0 up to, not including, 1', true);
      break;
    case 'clip':
      number('lower', 0, 100, 'a percentile from 0 to 100');
      number('upper', 0, 100, 'a percentile from 0 to 100');
      if ((step.lower as number) >= (step.upper as number)) bad('upper', `a percentile above lower (${String(step.lower)})`);
      break;
    default:
      break;
  }
  return step as unknown as RecipeStep;
}

function isObject(v: unknown): v is Fields {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Copies array defaults so parsed steps never share them. */
function structuredCloneFields(fields: Fields): Fields {
  const out: Fields = {};
  for (const [k, v] of Object.entries(fields)) out[k] = Array.isArray(v) ? [...(v as unknown[])] : v;
  return out;
}
