/** Rows of each subject: codes are small non-negative integers; -1 (no subject) belongs to none. */
export function subjectGroups(subjects: Int32Array): number[][] {
  const groups: number[][] = [];
  for (let i = 0; i < subjects.length; i++) {
    const s = subjects[i];
    if (s < 0) continue;
    while (groups.length <= s) groups.push([]);
    groups[s].push(i);
  }
  return groups;
}
