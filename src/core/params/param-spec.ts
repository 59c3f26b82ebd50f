import { OptionError } from '../errors';

/**
 * One parameter, defined once: its name in AnalysisParams-style objects, its command-line flag,
 * its label in the app's run panel, its kind and limits, its default and its help. The CLI parser
 * and usage text (src/cli/parse-command.ts), the run panel (src/app/components/ParamsPanel.svelte)
 * and the core's checks all read these records; see docs/parameters.md.
 */
export type ParamKind = 'integer' | 'number' | 'choice' | 'text' | 'list' | 'boolean';

export interface ParamChoice<V extends string = string> {
  value: V;
  /** How the run panel names it. */
  label: string;
}

export interface ParamSpec<V = unknown> {
  /** Field name in parameter objects and in messages from the core ("perplexity", "minDist"). */
  name: string;
  /** Command-line flag without the dashes ("perplexity", "min-dist"). */
  flag: string;
  /** Placeholder in the usage text ("<p>"); absent for a boolean flag. */
  meta?: string;
  /** Label in the run panel; absent when the panel does not show it. */
  label?: string;
  kind: ParamKind;
  /** Smallest valid value (integer, number); `exclusiveMin` makes it a strict bound. */
  min?: number;
  exclusiveMin?: boolean;
  /** Largest valid value (integer, number). */
  max?: number;
  /** The allowed values of a choice. */
  choices?: readonly ParamChoice[];
  default: V;
  /**
   * Usage text lines after the flag column; `{default}` is replaced by the default. The first
   * line sits beside the flag, the others under it.
   */
  help: readonly string[];
  /** What the run panel's input accepts (narrower than the valid range, for a usable control). */
  panel?: { min: number; max?: number; step?: number; title?: string };
}

/** The phrase for what a parameter accepts ("an integer >= 2", "a number > 0", "one of a, b"). */
export function expectedText(spec: ParamSpec, range: 'valid' | 'panel' = 'valid'): string {
  const { min, max } = range === 'panel' && spec.panel ? { min: spec.panel.min, max: spec.panel.max } : spec;
  const exclusive = range === 'valid' && spec.exclusiveMin === true;
  switch (spec.kind) {
    case 'integer':
      if (min !== undefined && max !== undefined) return `an integer from ${min} to ${max}`;
      return min !== undefined ? `an integer >= ${min}` : 'an integer';
    case 'number':
      if (min !== undefined && max !== undefined) return `a number from ${min} to ${max}`;
      return min !== undefined ? `a number ${exclusive ? '>' : '>='} ${min}` : 'a number';
    case 'choice':
      return `one of ${(spec.choices ?? []).map((c) => c.value).join(', ')}`;
    case 'list':
      return 'column names separated by commas';
    case 'boolean':
      return 'true or false';
    default:
      return 'a value';
  }
}

/** Whether a typed value lies in the parameter's valid (or panel) range. */
export function accepts(spec: ParamSpec, value: unknown, range: 'valid' | 'panel' = 'valid'): boolean {
  const { min, max } = range === 'panel' && spec.panel ? { min: spec.panel.min, max: spec.panel.max } : spec;
  const exclusive = range === 'valid' && spec.exclusiveMin === true;
  switch (spec.kind) {
    case 'integer':
    case 'number': {
      if (typeof value !== 'number' || !Number.isFinite(value)) return false;
      if (spec.kind === 'integer' && !Number.isSafeInteger(value)) return false;
      if (min !== undefined && (value < min || (exclusive && value === min))) return false;
      return max === undefined || value <= max;
    }
    case 'choice':
      return (spec.choices ?? []).some((c) => c.value === value);
    case 'boolean':
      return typeof value === 'boolean';
    case 'list':
      return Array.isArray(value) && value.every((v) => typeof v === 'string' && v !== '');
    default:
      return typeof value === 'string';
  }
}

/**
 * Checks a typed value; throws OptionError naming the parameter as `shownAs` (the field name by
 * default: the CLI passes "--flag", the app the panel label).
 */
export function checkParam<V>(spec: ParamSpec<V>, value: unknown, how: { shownAs?: string; range?: 'valid' | 'panel' } = {}): V {
  if (!accepts(spec, value, how.range)) throw new OptionError(how.shownAs ?? spec.name, value, expectedText(spec, how.range));
  return value as V;
}

/** A flag's text as a typed value (before range checks); NaN / undefined when it does not read as one. */
export function readFlagText(spec: ParamSpec, text: string): unknown {
  switch (spec.kind) {
    case 'integer':
      return /^[+]?\d+$/.test(text) ? Number(text) : NaN;
    case 'number':
      return /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text) ? Number(text) : NaN;
    case 'list': {
      const names = text.split(',').map((s) => s.trim());
      return names.some((s) => s === '') ? null : [...new Set(names)];
    }
    case 'boolean':
      return text === 'true' ? true : text === 'false' ? false : null;
    default:
      return text;
  }
}

/** Reads and checks one flag's text; throws OptionError naming the flag with the text given. */
export function parseFlag<V>(spec: ParamSpec<V>, text: string): V {
  const value = readFlagText(spec, text);
  if (!accepts(spec, value)) throw new OptionError(`--${spec.flag}`, text, expectedText(spec));
  return value as V;
}

/** The usage lines of some flags: flag column 2..20, help from column 21, `{default}` filled in. */
export function usageLines(specs: readonly ParamSpec[]): string[] {
  const lines: string[] = [];
  for (const s of specs) {
    const flag = `--${s.flag}${s.meta ? ` ${s.meta}` : ''}`;
    const col = flag.length < 19 ? flag.padEnd(19) : `${flag}  `;
    s.help.forEach((h, i) => {
      const text = h.replace('{default}', String(s.default));
      lines.push(i === 0 ? `  ${col}${text}` : `${' '.repeat(21)}${text}`);
    });
  }
  return lines;
}
