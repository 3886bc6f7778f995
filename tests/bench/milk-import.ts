/**
 * Milk-record import speed: a generated 200 000-row file (2 000 cows × 100 days, fat and
 * protein) read by the same papaparse step-mode reader the server runs on the upload stream.
 */
import { parseMilkRecordCsv } from '../../shared/milk-records/parse';
import { generateMilkCsv } from '../helpers/milk-csv';
import { bench, type TableRow } from './harness';

// docs/product.md (Documents and milk records): "files up to 200 000 rows within a few seconds"; 3 s is our reading of "a few".
const TARGET_S = 3;

/** Times the 200 000-row read and returns its table row. */
export function milkImportBench(): TableRow[] {
  const { text } = generateMilkCsv({ cows: 2000, days: 100, fatProtein: true });
  const result = bench('milk-record CSV, 200 000 rows', () => parseMilkRecordCsv(text), 3, 1);
  return [
    {
      name: result.name,
      value: `${(result.medianMs / 1000).toFixed(3)} s`,
      cpu: `${(result.medianCpuMs / 1000).toFixed(3)} s`,
      target: `< ${TARGET_S} s`,
      pass: result.medianCpuMs / 1000 < TARGET_S,
    },
  ];
}
