import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { FeatureMatrix } from '../../src/core/analysis.types';
import { parseCsv } from '../../src/core/table/csv';
import type { Table } from '../../src/core/table/table';

/**
 * Fisher's iris data in the R `datasets` version (= scikit-learn >= 0.20), typed into
 * test/fixtures/iris.csv; iris.test.ts checks it against the class means and rows 35 and 38
 * of that version (R datasets::iris).
 */
export function irisTable(): Table {
  const path = fileURLToPath(new URL('../fixtures/iris.csv', import.meta.url));
  return parseCsv(readFileSync(path), 'iris.csv');
}

/** The four measurements as a 150 × 4 matrix, and the species per row. */
export function irisMatrix(): FeatureMatrix & { species: Int32Array } {
  const t = irisTable();
  const names = ['sepal_length', 'sepal_width', 'petal_length', 'petal_width'];
  const data = new Float64Array(150 * 4);
  names.forEach((name, j) => {
    const c = t.columns.find((col) => col.name === name);
    if (!c || c.kind !== 'numeric') throw new Error(`iris fixture lacks numeric ${name}`);
    for (let i = 0; i < 150; i++) data[i * 4 + j] = c.values[i];
  });
  const sp = t.columns.find((col) => col.name === 'species');
  if (!sp || sp.kind !== 'categorical') throw new Error('iris fixture lacks species');
  return { data, n: 150, d: 4, featureNames: names, species: sp.codes };
}
