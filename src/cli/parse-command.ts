import { parseArgs } from 'node:util';
import { parseFlag, usageLines, type ParamSpec } from '../core/params';
import { UsageError } from './usage-error';

/** One flag of a command: a parameter of the schema, optionally with help worded for this command. */
export interface CommandFlag {
  spec: ParamSpec;
  help?: readonly string[];
  /** May be given several times (each value is kept, in order, in `ParsedCommand.lists`). */
  repeatable?: boolean;
  /** Its value may be empty (`--na ''`). */
  emptyValue?: boolean;
}

export interface CommandSpec {
  /** "analyze", "sweep", "run": used in messages ("unknown option ... for sweep"). */
  name: string;
  /** Whether messages name the command ("for sweep"): analyze's do not. */
  named: boolean;
  flags: readonly CommandFlag[];
}

export interface ParsedCommand {
  /** Flag texts by flag name (booleans as 'true'), before any typing; of a repeatable flag, the last. */
  texts: Map<string, string>;
  /** Every text of each repeatable flag given, in order. */
  lists: Map<string, string[]>;
  positionals: string[];
}

/**
 * Splits argv with node:util parseArgs (its tokens, non-strict), then applies our rules so that
 * every command reports mistakes alike: unknown flags (and single-dash or "--" arguments), a flag
 * given twice, a value flag without a value. Values are typed later (`value`), from the schema.
 */
export function parseCommand(argv: readonly string[], command: CommandSpec): ParsedCommand {
  const byFlag = new Map(command.flags.map((f) => [f.spec.flag, f.spec]));
  const flagOf = new Map(command.flags.map((f) => [f.spec.flag, f]));
  const options = Object.fromEntries(command.flags.map((f) => [f.spec.flag, { type: f.spec.kind === 'boolean' ? ('boolean' as const) : ('string' as const) }]));
  const { tokens } = parseArgs({ args: [...argv], options, strict: false, allowPositionals: true, tokens: true });
  const texts = new Map<string, string>();
  const lists = new Map<string, string[]>();
  const positionals: string[] = [];
  const suffix = command.named ? ` for ${command.name}` : '';
  for (const t of tokens) {
    if (t.kind === 'positional') { positionals.push(t.value); continue; }
    if (t.kind === 'option-terminator') throw new UsageError(`unknown option "--"${suffix}`);
    const spec = byFlag.get(t.name);
    const boolean = spec?.kind === 'boolean';
    if (!spec || !t.rawName.startsWith('--') || (boolean && t.inlineValue)) throw new UsageError(`unknown option "${t.rawName}"${suffix}`);
    const flag = flagOf.get(spec.flag);
    if (texts.has(spec.flag) && !flag?.repeatable) throw new UsageError(`option --${spec.flag} given twice`);
    if (boolean) { texts.set(spec.flag, 'true'); continue; }
    // A value that is itself a flag ("--k --out x") means the value is missing, as does "--k=".
    const value = t.value === undefined || (!t.inlineValue && t.value.startsWith('--')) ? undefined : t.value;
    if (value === undefined || (value === '' && !flag?.emptyValue)) throw new UsageError(`option --${spec.flag} needs a value`);
    texts.set(spec.flag, value);
    if (flag?.repeatable) lists.set(spec.flag, [...(lists.get(spec.flag) ?? []), value]);
  }
  return { texts, lists, positionals };
}

/** The typed value of a flag (checked against the schema), or `fallback` when it was not given. */
export function value<V>(parsed: ParsedCommand, spec: ParamSpec<V>, fallback: V = spec.default): V {
  const text = parsed.texts.get(spec.flag);
  return text === undefined ? fallback : parseFlag(spec, text);
}

/** The usage lines of a command's flags, in its order, each with its own or the schema's help. */
export function commandUsage(command: CommandSpec): string {
  return command.flags.map((f) => usageLines([f.help ? { ...f.spec, help: f.help } : f.spec])).flat().join('\n');
}
