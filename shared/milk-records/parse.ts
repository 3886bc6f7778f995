/**
 * Reads a milk-record CSV (one row per cow per test day or per day) into accepted rows,
 * refused rows with reasons, and the herd summary the baseline takes: distinct cows and mean
 * kg/cow/day over the file's last MILK_RECORD_PERIOD_DAYS days. Pure: the caller feeds rows
 * (the server straight from the upload stream through papaparse's step mode); no I/O here.
 */
import Papa from 'papaparse';
import {
  MILK_RECORD_PERIOD_DAYS,
  type MilkRecordRow,
  type MilkRecordSummary,
  type RefusalReason,
  type RefusedRow,
} from '../schema/milk-records';
import { KG_PER_LB } from '../units';

/** At most this many refused rows are listed; the counts by reason cover them all. */
export const MAX_REFUSED_LISTED = 500;
const SAMPLE_ROWS = 10;
const MS_PER_DAY = 86_400_000;

/** A file the reader cannot use at all (no header it understands); `field` names what is wrong. */
export class MilkRecordFileError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
  }
}

type MilkUnit = 'kg' | 'lb';

interface Columns {
  cow: number;
  date: number;
  milk: number;
  /** Unit from the milk column's header, when it names one. */
  headerUnit: MilkUnit | null;
  unit: number | null;
  fat: number | null;
  protein: number | null;
}

/** Lower case, no BOM, punctuation and spacing folded: "Milk (kg)" → "milk kg", "Fat %" → "fat". */
function normaliseHeader(name: string): string {
  return name
    .replace(/^\uFEFF/, '')
    .toLowerCase()
    .replace(/[\s_\-()[\]%.:/]+/g, ' ')
    .trim();
}

const COW_NAMES = new Set(['cow', 'cow id', 'cowid', 'cow no', 'cow number', 'cow nr', 'animal', 'animal id', 'ear tag', 'tag']);
const DATE_NAMES = new Set(['date', 'test date', 'testdate', 'recording date', 'test day', 'day']);
const UNIT_NAMES = new Set(['unit', 'units', 'milk unit']);
const FAT_NAMES = new Set(['fat', 'fat pct', 'fat percent', 'butterfat']);
const PROTEIN_NAMES = new Set(['protein', 'protein pct', 'protein percent']);
const MILK_PATTERN = /^(?:milk|milk yield|yield|milk weight)(?: (kg|kgs|kilograms?|lb|lbs|pounds?))?$/;

/** Maps a unit word to kg or lb; null for anything else. */
export function readUnit(word: string): MilkUnit | null {
  const w = word.trim().toLowerCase();
  if (w === 'kg' || w === 'kgs' || w === 'kilogram' || w === 'kilograms') return 'kg';
  if (w === 'lb' || w === 'lbs' || w === 'pound' || w === 'pounds') return 'lb';
  return null;
}

/** Finds the columns in a header row; throws MilkRecordFileError naming what is missing. */
export function findColumns(header: readonly string[]): Columns {
  const names = header.map(normaliseHeader);
  const find = (set: Set<string>): number | null => {
    const index = names.findIndex((n) => set.has(n));
    return index === -1 ? null : index;
  };
  const cow = find(COW_NAMES);
  const date = find(DATE_NAMES);
  let milk: number | null = null;
  let headerUnit: MilkUnit | null = null;
  names.forEach((n, i) => {
    const match = MILK_PATTERN.exec(n);
    if (match && milk === null) {
      milk = i;
      headerUnit = match[1] ? readUnit(match[1]) : null;
    }
  });
  const unit = find(UNIT_NAMES);
  const shown = header.map((h) => `"${h.replace(/^\uFEFF/, '').trim()}"`).join(', ');
  if (cow === null) throw new MilkRecordFileError('cowId', `No cow id column (expected "cow id"); the header has ${shown}`);
  if (date === null) throw new MilkRecordFileError('date', `No date column (expected "date" or "test date"); the header has ${shown}`);
  if (milk === null) throw new MilkRecordFileError('milk', `No milk column (expected "milk kg" or "milk lb"); the header has ${shown}`);
  if (headerUnit === null && unit === null) {
    throw new MilkRecordFileError('milk', 'The milk column does not say its unit: name it "milk kg" or "milk lb", or add a "unit" column');
  }
  return { cow, date, milk, headerUnit, unit, fat: find(FAT_NAMES), protein: find(PROTEIN_NAMES) };
}

/** Picks ',' or ';' by which is more frequent in the first line (a header has no decimal commas). */
export function guessDelimiter(firstChunk: string): ',' | ';' {
  const end = firstChunk.search(/\r?\n/);
  const line = end === -1 ? firstChunk : firstChunk.slice(0, end);
  const count = (c: string) => line.split(c).length - 1;
  return count(';') > count(',') ? ';' : ',';
}

/**
 * Day number (days since 1970-01-01, UTC) of a date written YYYY-MM-DD, YYYY/MM/DD or DD.MM.YYYY;
 * null for anything else or an impossible date (31.02.2026).
 */
export function parseDay(text: string): number | null {
  const t = text.trim();
  let m = /^(\d{4})[-/](\d{1,2})[-/](\d{1,2})$/.exec(t);
  let y: number, mo: number, d: number;
  if (m) {
    y = Number(m[1]);
    mo = Number(m[2]);
    d = Number(m[3]);
  } else {
    m = /^(\d{1,2})\.(\d{1,2})\.(\d{4})$/.exec(t);
    if (!m) return null;
    d = Number(m[1]);
    mo = Number(m[2]);
    y = Number(m[3]);
  }
  if (y < 1900 || y > 2200 || mo < 1 || mo > 12 || d < 1) return null;
  const ms = Date.UTC(y, mo - 1, d);
  if (new Date(ms).getUTCDate() !== d) return null;
  return ms / MS_PER_DAY;
}

/** ISO date (YYYY-MM-DD) of a day number. */
export function dayToIso(day: number): string {
  return new Date(day * MS_PER_DAY).toISOString().slice(0, 10);
}

/** A decimal with a point or a comma ("28.5", "28,5", "-3"); null when not a plain number. */
export function parseDecimal(text: string): number | null {
  const t = text.trim();
  if (!/^[-+]?(?:\d+(?:[.,]\d*)?|[.,]\d+)$/.test(t)) return null;
  return Number(t.replace(',', '.'));
}

export interface MilkRecordReader {
  /** Feeds the header row; throws MilkRecordFileError when it lacks a needed column. */
  header(fields: readonly string[]): void;
  /** Feeds one data row; `line` is its line in the file (header = 1). */
  row(fields: readonly string[], line: number): void;
  /** The summary of everything fed; `rows` only when the reader was made with keepRows. */
  finish(delimiter: ',' | ';'): MilkRecordSummary & { rows?: MilkRecordRow[] };
}

/**
 * An incremental reader: memory grows with distinct (cow, date) pairs and days, not with the
 * file, unless `keepRows` asks for every accepted row (tests, small files).
 */
export function createMilkRecordReader(options: { keepRows?: boolean } = {}): MilkRecordReader {
  let columns: Columns | null = null;
  let rowsRead = 0;
  let rowsAccepted = 0;
  let rowsRefused = 0;
  const refused: RefusedRow[] = [];
  const refusedByReason: Partial<Record<RefusalReason, number>> = {};
  const seen = new Map<string, number>();
  const cowLastDay = new Map<string, number>();
  const perDay = new Map<number, { kg: number; n: number }>();
  const sample: MilkRecordRow[] = [];
  const kept: MilkRecordRow[] = [];
  let firstDay = Infinity;
  let lastDay = -Infinity;

  const refuse = (line: number, reason: RefusalReason, detail: string): void => {
    rowsRefused += 1;
    refusedByReason[reason] = (refusedByReason[reason] ?? 0) + 1;
    if (refused.length < MAX_REFUSED_LISTED) refused.push({ line, reason, detail });
  };

  const percent = (fields: readonly string[], index: number | null): number | null | 'bad' => {
    if (index === null) return null;
    const raw = (fields[index] ?? '').trim();
    if (raw === '') return null;
    const value = parseDecimal(raw);
    return value === null || value < 0 || value > 100 ? 'bad' : value;
  };

  return {
    header(fields) {
      columns = findColumns(fields);
    },
    row(fields, line) {
      if (!columns) throw new Error('row() before header()');
      if (fields.every((f) => f.trim() === '')) return;
      rowsRead += 1;
      const cowId = (fields[columns.cow] ?? '').trim();
      if (cowId === '') return refuse(line, 'missing_cow', 'cow id is empty');
      const dateText = fields[columns.date] ?? '';
      const day = parseDay(dateText);
      if (day === null) return refuse(line, 'bad_date', `date "${dateText.trim()}" (use YYYY-MM-DD or DD.MM.YYYY)`);
      const milkText = (fields[columns.milk] ?? '').trim();
      const amount = parseDecimal(milkText);
      if (amount === null) return refuse(line, 'bad_milk', `milk "${milkText}"`);
      if (amount < 0) return refuse(line, 'negative_milk', `milk ${milkText}`);
      let unit = columns.headerUnit;
      if (columns.unit !== null) {
        const unitText = fields[columns.unit] ?? '';
        unit = readUnit(unitText);
        if (unit === null) return refuse(line, 'unknown_unit', `unit "${unitText.trim()}" (use kg or lb)`);
      }
      const fatPct = percent(fields, columns.fat);
      if (fatPct === 'bad') return refuse(line, 'bad_fat', `fat "${(fields[columns.fat ?? 0] ?? '').trim()}"`);
      const proteinPct = percent(fields, columns.protein);
      if (proteinPct === 'bad') return refuse(line, 'bad_protein', `protein "${(fields[columns.protein ?? 0] ?? '').trim()}"`);
      const key = `${cowId}\u0000${day}`;
      const earlier = seen.get(key);
      if (earlier !== undefined) return refuse(line, 'duplicate_row', `cow ${cowId} on ${dayToIso(day)} is already on line ${earlier}`);
      seen.set(key, line);

      const milkKg = unit === 'lb' ? amount * KG_PER_LB : amount;
      rowsAccepted += 1;
      if (day < firstDay) firstDay = day;
      if (day > lastDay) lastDay = day;
      const previous = cowLastDay.get(cowId);
      if (previous === undefined || day > previous) cowLastDay.set(cowId, day);
      const total = perDay.get(day);
      if (total) {
        total.kg += milkKg;
        total.n += 1;
      } else {
        perDay.set(day, { kg: milkKg, n: 1 });
      }
      if (sample.length < SAMPLE_ROWS || options.keepRows) {
        const record: MilkRecordRow = { line, cowId, date: dayToIso(day), milkKg, fatPct, proteinPct };
        if (sample.length < SAMPLE_ROWS) sample.push(record);
        if (options.keepRows) kept.push(record);
      }
    },
    finish(delimiter) {
      const unit = columns?.unit !== null && columns?.unit !== undefined ? 'per row' : (columns?.headerUnit ?? 'kg');
      const any = rowsAccepted > 0;
      const periodStart = lastDay - (MILK_RECORD_PERIOD_DAYS - 1);
      let herdSize = 0;
      for (const day of cowLastDay.values()) if (day >= periodStart) herdSize += 1;
      let kg = 0;
      let n = 0;
      for (const [day, total] of perDay) {
        if (day >= periodStart) {
          kg += total.kg;
          n += total.n;
        }
      }
      return {
        delimiter,
        unit,
        rowsRead,
        rowsAccepted,
        rowsRefused,
        refusedByReason,
        refused,
        refusedTruncated: rowsRefused > refused.length,
        cowsInFile: cowLastDay.size,
        firstDate: any ? dayToIso(firstDay) : null,
        lastDate: any ? dayToIso(lastDay) : null,
        period: any ? { from: dayToIso(periodStart), to: dayToIso(lastDay), days: MILK_RECORD_PERIOD_DAYS } : null,
        herdSize,
        recordsInPeriod: n,
        averageYieldKgPerCowDay: n > 0 ? Math.round((kg / n) * 100) / 100 : null,
        sample,
        ...(options.keepRows ? { rows: kept } : {}),
      };
    },
  };
}

/** Papaparse options shared by the string and the stream reader: raw rows, our own header handling. */
export function papaConfig(): Pick<Papa.ParseConfig, 'header' | 'skipEmptyLines' | 'delimiter'> {
  return { header: false, skipEmptyLines: false, delimiter: guessDelimiter };
}

/**
 * Feeds papaparse's step results to a reader, tracking lines (header = 1). Returns the step
 * callback and a getter for the delimiter papaparse settled on.
 */
export function stepInto(reader: MilkRecordReader): {
  step: (results: Papa.ParseStepResult<string[]>, parser: Papa.Parser) => void;
  delimiter: () => ',' | ';';
  error: () => MilkRecordFileError | null;
} {
  let line = 0;
  let delimiter: ',' | ';' = ',';
  let failure: MilkRecordFileError | null = null;
  return {
    step(results, parser) {
      line += 1;
      if (line === 1) {
        delimiter = results.meta.delimiter === ';' ? ';' : ',';
        try {
          reader.header(results.data);
        } catch (e) {
          if (!(e instanceof MilkRecordFileError)) throw e;
          failure = e;
          parser.abort();
        }
        return;
      }
      reader.row(results.data, line);
    },
    delimiter: () => delimiter,
    error: () => failure,
  };
}

/** Reads a whole milk-record CSV held in a string; throws MilkRecordFileError for an unusable file. */
export function parseMilkRecordCsv(text: string, options: { keepRows?: boolean } = {}): MilkRecordSummary & { rows?: MilkRecordRow[] } {
  if (text.replace(/^\uFEFF/, '').trim() === '') throw new MilkRecordFileError('file', 'The file is empty');
  const reader = createMilkRecordReader(options);
  const feed = stepInto(reader);
  Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { ...papaConfig(), step: feed.step });
  const failure = feed.error();
  if (failure) throw failure;
  return reader.finish(feed.delimiter());
}
