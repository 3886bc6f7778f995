/**
 * Source tags follow edits (docs/design.md "Habits": a number shows where it came from): a figure
 * the farm types becomes its own ("user"), a capital line backed by a quote with an amount
 * becomes "quote". The earlier tag is kept in the note, so the lender still sees what the default was.
 */
import type { Option, Source } from './schema/option';

const KIND_WORDS: Record<Source['kind'], string> = {
  reference: 'reference',
  'common-practice': 'common practice',
  assumption: 'assumption',
  user: 'the farm',
  quote: 'quote',
};

/** Longest note the schema keeps (shared/schema/option.ts). */
const NOTE_MAX = 500;

function clip(text: string): string {
  return text.length <= NOTE_MAX ? text : `${text.slice(0, NOTE_MAX - 1)}…`;
}

/** The tag a typed figure gets: the farm's own, noting the default it replaced. */
export function typedSource(previous: Source | undefined): Source {
  if (previous?.kind === 'user') return previous;
  const was = previous ? ` (the default was ${KIND_WORDS[previous.kind]}${previous.note ? `: ${previous.note}` : ''})` : '';
  return { kind: 'user', note: clip(`Entered by the farm${was}`) };
}

/** Marks `key` (a path inside the option, as its `sources` record names it) as typed by the farm. */
export function markTyped(option: Pick<Option, 'sources'>, key: string): void {
  const next = typedSource(option.sources[key]);
  if (option.sources[key] !== next) option.sources[key] = next;
}

/** The source key of a capital line's cost: its unit cost, or a contingency's rate. */
export function capitalCostKey(line: { id: string; kind: 'item' | 'contingency' }): string {
  return `capitalLines.${line.id}.${line.kind === 'item' ? 'unitCost' : 'rate'}`;
}

/** The tag of a capital line backed by quotes: the files and the quoted total. */
export function quoteSource(files: readonly string[], total: string): Source {
  return { kind: 'quote', note: clip(`${total}${files.length ? ` (${files.join(', ')})` : ''}`) };
}
