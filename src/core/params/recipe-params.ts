import type { ParamSpec } from './param-spec';

/** How the command line builds a recipe without a recipe file (--scale, --impute). */
export const SCALE_CHOICES = ['zscore', 'robust', 'subject-zscore', 'minmax', 'none'] as const;
export type ScaleChoice = (typeof SCALE_CHOICES)[number];
export const IMPUTE_CHOICES = ['mean', 'median', 'subject-median', 'drop'] as const;
export type ImputeChoice = (typeof IMPUTE_CHOICES)[number];

const choices = <T extends string>(values: readonly T[]) => values.map((value) => ({ value, label: value }));

/** The table and recipe parameters of a run: which columns mean what, how the features are prepared. */
export const INPUT_PARAMS = {
  compose: {
    name: 'compose', flag: 'compose', meta: '<cols>', kind: 'list', default: [] as string[],
    help: [
      'also report the mix of these categorical columns (comma-separated, e.g.',
      'device,site) per cluster in summary.json, as is done for the subject',
    ],
  } satisfies ParamSpec<string[]>,
  scale: {
    name: 'scale', flag: 'scale', meta: '<how>', kind: 'choice', default: 'zscore' as ScaleChoice, choices: choices(SCALE_CHOICES),
    help: ['zscore (default), robust (median/IQR), subject-zscore (within each', 'subject), minmax or none'],
  } satisfies ParamSpec<ScaleChoice>,
  impute: {
    name: 'impute', flag: 'impute', meta: '<how>', kind: 'choice', default: 'mean' as ImputeChoice, choices: choices(IMPUTE_CHOICES),
    help: [
      'missing values: mean (default), median, subject-median (each subject\'s',
      'own median) or drop (leave out windows with any missing value)',
    ],
  } satisfies ParamSpec<ImputeChoice>,
  subject: {
    name: 'subject', flag: 'subject', meta: '<column>', kind: 'text', default: '',
    help: ['the column naming each window\'s subject (default: inferred)'],
  } satisfies ParamSpec<string>,
  recipe: {
    name: 'recipe', flag: 'recipe', meta: '<file>', kind: 'text', default: '',
    help: [
      'a recipe JSON file {"version": 1, "steps": [...]} instead of --scale and',
      '--impute; the recipe used is written into summary.json',
    ],
  } satisfies ParamSpec<string>,
  events: {
    name: 'events', flag: 'events', kind: 'boolean', default: false,
    help: [
      'also write <dir>/events.tsv (BIDS-style segments of consecutive windows',
      'of one cluster per subject) and sub-<subject>_annotations.edf (EDF+)',
    ],
  } satisfies ParamSpec<boolean>,
} as const;
