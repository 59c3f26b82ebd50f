/**
 * Cautions shown to users wherever results leave the app (exports, CLI summaries, the About
 * panel). Text as set by the product design, section 6.
 */
export const CAUTIONS: string[] = [
  'Weak labels and clusters are research aids, not clinical findings or diagnoses.',
  'Handle participant data under your ethics approval, consent terms and local privacy law.',
  'Gleaner keeps data on this machine: nothing is uploaded.',
];
