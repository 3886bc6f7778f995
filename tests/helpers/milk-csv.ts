/**
 * Invented milk-record files for tests and the benchmark: `cows` cows tested every
 * `intervalDays` days over `days` days, milk values from a fixed formula so tests can compute
 * the expected herd size and yield themselves, without the reader under test.
 */

export interface GeneratedRecord {
  cowId: string;
  /** Days after the start date. */
  day: number;
  /** The number written in the file, in the file's unit. */
  milk: number;
}

export interface MilkCsvOptions {
  cows: number;
  days: number;
  intervalDays?: number;
  start?: string;
  delimiter?: ',' | ';';
  unit?: 'kg' | 'lb';
  bom?: boolean;
  fatProtein?: boolean;
}

/** ISO date `offset` days after `start` (UTC). */
export function isoDay(start: string, offset: number): string {
  return new Date(Date.parse(`${start}T00:00:00Z`) + offset * 86_400_000).toISOString().slice(0, 10);
}

/** Milk of a cow on a day, 18.0–41.9, one decimal (an invented pattern). */
export function milkFor(cow: number, day: number, unit: 'kg' | 'lb'): number {
  const kg = 18 + ((cow * 7 + day * 3) % 240) / 10;
  return unit === 'kg' ? kg : Math.round((kg / 0.45) * 10) / 10;
}

/** The CSV text and the records it holds. Cow `c` is tested on days c % intervalDays, + interval, …. */
export function generateMilkCsv(options: MilkCsvOptions): { text: string; records: GeneratedRecord[] } {
  const { cows, days, intervalDays = 1, start = '2026-03-01', delimiter = ',', unit = 'kg', bom = false, fatProtein = false } = options;
  const decimal = delimiter === ';' ? ',' : '.';
  const header = ['Cow ID', 'Test date', `Milk ${unit}`, ...(fatProtein ? ['Fat %', 'Protein %'] : [])].join(delimiter);
  const lines: string[] = [header];
  const records: GeneratedRecord[] = [];
  for (let day = 0; day < days; day += 1) {
    for (let cow = 1; cow <= cows; cow += 1) {
      if ((day - (cow % intervalDays) + intervalDays) % intervalDays !== 0) continue;
      const milk = milkFor(cow, day, unit);
      const cowId = `C${String(cow).padStart(5, '0')}`;
      records.push({ cowId, day, milk });
      const fields = [cowId, isoDay(start, day), String(milk).replace('.', decimal)];
      if (fatProtein) fields.push(String(3.5 + (cow % 10) / 10).replace('.', decimal), String(3.1 + (day % 5) / 10).replace('.', decimal));
      lines.push(fields.join(delimiter));
    }
  }
  return { text: `${bom ? '\uFEFF' : ''}${lines.join('\r\n')}\r\n`, records };
}

/**
 * Herd size and mean yield computed straight from the records: distinct cows and mean kg per
 * record over the 30 days ending on the last record's day (docs/product.md, Documents and milk records: the last 30-day period).
 */
export function expectedSummary(records: readonly GeneratedRecord[], kgPerUnit: number): { herdSize: number; averageKg: number; lastDay: number } {
  const lastDay = records.reduce((max, r) => Math.max(max, r.day), -Infinity);
  const inPeriod = records.filter((r) => r.day > lastDay - 30);
  const herdSize = new Set(inPeriod.map((r) => r.cowId)).size;
  const averageKg = inPeriod.reduce((sum, r) => sum + r.milk * kgPerUnit, 0) / inPeriod.length;
  return { herdSize, averageKg, lastDay };
}
