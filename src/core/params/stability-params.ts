import type { ParamSpec } from './param-spec';

/** Stability across subjects (src/core/stability): asked for separately from the run itself. */
export const STABILITY_PARAMS = {
  stability: {
    name: 'stability', flag: 'stability', meta: '<B>', kind: 'integer', min: 1, max: 1000, default: 20,
    help: [
      'also assess each cluster\'s stability across subjects: B resamples (20 is a',
      'good start) each leaving out a seeded quarter of the subjects, the run\'s recipe',
      'and clustering again, Jaccard matching; summary.json gains clusters[].stability',
    ],
  } satisfies ParamSpec<number>,
};
