/**
 * Source tags follow edits (docs/design.md "Habits": a number shows where it came from): a typed
 * figure becomes the farm's own, keeping what the default was; a quoted line shows the quote.
 */
import { describe, expect, it } from 'vitest';
import { sourceSchema } from '../../shared/schema';
import { capitalCostKey, markTyped, quoteSource, typedSource } from '../../shared/source-edits';

describe('source tags on edit', () => {
  it('turns an assumption the farm types over into its own figure, noting the default', () => {
    const option = { sources: { lyingHoursPerDay: { kind: 'assumption' as const, note: 'planning figure' } } };
    markTyped(option, 'lyingHoursPerDay');
    expect(option.sources.lyingHoursPerDay).toEqual({ kind: 'user', note: 'Entered by the farm (the default was assumption: planning figure)' });
    expect(sourceSchema.safeParse(option.sources.lyingHoursPerDay).success).toBe(true);
  });

  it('leaves a figure already the farm’s as it is when typed again', () => {
    const own = { kind: 'user' as const, note: 'Entered by the farm' };
    expect(typedSource(own)).toBe(own);
  });

  it('tags a figure without a default as the farm’s', () => {
    const option: { sources: Record<string, { kind: 'user' | 'assumption'; note: string }> } = { sources: {} };
    markTyped(option, capitalCostKey({ id: 'sand.shell', kind: 'item' }));
    expect(option.sources['capitalLines.sand.shell.unitCost']?.kind).toBe('user');
  });

  it('keeps the note within the schema’s 500 characters', () => {
    const long = typedSource({ kind: 'reference', note: 'x'.repeat(500) });
    expect(long.note.length).toBeLessThanOrEqual(500);
    expect(sourceSchema.safeParse(long).success).toBe(true);
  });

  it('writes a quote tag the schema accepts', () => {
    const quote = quoteSource(['shell.pdf'], '€386,400');
    expect(quote).toEqual({ kind: 'quote', note: '€386,400 (shell.pdf)' });
    expect(sourceSchema.safeParse(quote).success).toBe(true);
  });
});
