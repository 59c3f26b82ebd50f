import type { MissingnessReport } from './quality.types';

/**
 * Missing shares per feature and per subject × feature. Subject codes index `subjectNames`;
 * windows with code -1 count in the per-feature shares only.
 */
export function missingness(data: Float64Array, n: number, d: number, subjectCodes?: Int32Array, subjectNames: string[] = []): Omit<MissingnessReport, 'issues'> {
  const perFeature = new Float64Array(d);
  let nSubjects = subjectNames.length;
  if (subjectCodes) for (let i = 0; i < n; i++) nSubjects = Math.max(nSubjects, subjectCodes[i] + 1);
  const perSubject = new Float64Array(nSubjects * d);
  const windowsPerSubject = new Float64Array(nSubjects);
  let windowsWithMissing = 0;
  let total = 0;
  for (let i = 0; i < n; i++) {
    const s = subjectCodes ? subjectCodes[i] : -1;
    if (s >= 0) windowsPerSubject[s]++;
    let any = false;
    for (let j = 0; j < d; j++) {
      if (data[i * d + j] === data[i * d + j]) continue;
      perFeature[j]++;
      if (s >= 0) perSubject[s * d + j]++;
      any = true;
      total++;
    }
    if (any) windowsWithMissing++;
  }
  for (let j = 0; j < d; j++) perFeature[j] /= n;
  for (let s = 0; s < nSubjects; s++) for (let j = 0; j < d; j++) perSubject[s * d + j] = windowsPerSubject[s] > 0 ? perSubject[s * d + j] / windowsPerSubject[s] : 0;
  const subjects = Array.from({ length: nSubjects }, (_, s) => subjectNames[s] ?? `subject ${s}`);
  return { perFeature, subjects, perSubject, windowsWithMissing, total };
}
