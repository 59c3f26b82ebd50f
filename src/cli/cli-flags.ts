import type { ParamSpec } from '../core/params';
import { PROGRESS_MODES, type ProgressMode } from './progress-bar';

/** Flags of the command line itself (where outputs go, how progress shows), beside the schema's parameters. */
export const OUT: ParamSpec<string> = {
  name: 'out', flag: 'out', meta: '<dir>', kind: 'text', default: '',
  help: ['folder for the outputs (created if missing; never the input\'s own file)'],
};

export const PROGRESS: ParamSpec<ProgressMode> = {
  name: 'progress', flag: 'progress', meta: '<mode>', kind: 'choice', default: 'auto',
  choices: PROGRESS_MODES.map((value) => ({ value, label: value })),
  help: ['auto (a bar on a terminal, else nothing), bar, lines (plain lines for', 'batch logs) or none (default auto)'],
};

/** The shorter help the other commands give --progress. */
export const PROGRESS_SHORT = ['auto, bar, lines or none (default auto)'];

export const JSON_FLAG: ParamSpec<boolean> = {
  name: 'json', flag: 'json', kind: 'boolean', default: false, help: ['print JSON instead of the table'],
};
