/**
 * The client words every error in one place (src/api/messages.ts): field paths become the forms'
 * labels, each server error code has its wording, and no screen or store reads an error's raw
 * message itself. docs/design.md "Habits": every error says what to fix.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ApiError } from '@/api/client';
import { fieldLabel, HERD_LABELS, OPTION_LABELS, SCENARIO_LABELS } from '@/api/field-labels';
import { inlineMessage, messageFor } from '@/api/messages';
import { errorCodes } from '@shared/responses';

const invalid = (fields: Record<string, string>) => {
  const [path, message] = Object.entries(fields)[0] ?? ['', ''];
  return new ApiError(400, { code: 'invalid_input', message: `${path}: ${message}`, fields });
};

describe('messageFor', () => {
  it('names a scenario field as the herd form does, without its path', () => {
    const text = messageFor(invalid({ 'scenario.herd.cows': 'Herd size must be a whole number' }));
    expect(text).toBe('Cows in the herd: must be a whole number');
    expect(text).not.toMatch(/scenario\.|herd\.cows/);
  });

  it('names an option and a capital line by their names', () => {
    const scenario = {
      options: [
        { id: 'now', name: 'Grazing today', capitalLines: [] },
        { id: 'sand', name: 'Sand freestall', capitalLines: [{ id: 'sand.shell', description: 'Shell and roof' }] },
      ],
    } as never;
    expect(messageFor(invalid({ 'scenario.options.1.capitalLines.0.unitCost': 'Capital line unit cost must be at least 0' }), undefined, scenario)).toBe(
      'Unit cost of “Shell and roof” in “Sand freestall”: must be at least 0',
    );
    expect(messageFor(invalid({ 'options.0.lyingHoursPerDay': 'Lying time must be at most 16 h' }), undefined, scenario)).toBe('Lying time in “Grazing today”: must be at most 16 h');
  });

  it('rewrites a path-led sentence even without field details', () => {
    const error = new ApiError(409, { code: 'out_of_range', message: 'herd.yieldKgPerCowDay: is beyond what the model uses' });
    expect(messageFor(error)).toBe('Milk yield in the herd: is beyond what the model uses');
  });

  it('has a wording for every code the server sends, and none shows a path', () => {
    // The codes come from shared/responses.ts, the list server/errors.ts types AppError with.
    for (const code of errorCodes) {
      const text = messageFor(new ApiError(400, { code, message: `some.field.path: detail for ${code}` }), 'FALLBACK');
      expect(text, code).not.toBe('FALLBACK');
      expect(text, code).not.toMatch(/some\.field\.path/);
    }
  });

  it('names the field beside its input by the label shown there', () => {
    expect(inlineMessage('Cows', 'Herd size must be a whole number')).toBe('Cows must be a whole number');
    expect(inlineMessage('Troughs', 'No trough fits')).toBe('No trough fits');
    expect(inlineMessage('Cows', undefined)).toBeUndefined();
  });

  it('keeps the server sentence when it is written for people', () => {
    const error = new ApiError(429, { code: 'rate_limited', message: 'Too many attempts. Try again in 4 minutes.' });
    expect(messageFor(error)).toBe('Too many attempts. Try again in 4 minutes.');
  });

  it('says what the screen was doing for an error that is not from the API', () => {
    expect(messageFor(new Error('boom'), 'Could not load the farm')).toBe('Could not load the farm');
    expect(messageFor(new ApiError(0, { code: 'network', message: 'x' }))).toMatch(/Cannot reach Byrecast/);
  });
});

const FORMS: Record<string, { file: string; table: Readonly<Record<string, string>>; prefix?: string }> = {
  herd: { file: 'src/components/HerdForm.vue', table: HERD_LABELS },
  finance: { file: 'src/components/FinanceForm.vue', table: SCENARIO_LABELS },
  details: { file: 'src/components/OptionDetailsForm.vue', table: OPTION_LABELS },
  sizing: { file: 'src/components/SizingHelpers.vue', table: OPTION_LABELS },
  running: { file: 'src/components/RunningCostsForm.vue', table: OPTION_LABELS },
};

describe('field labels', () => {
  it.each(Object.entries(FORMS))('match the labels of the %s form', (_name, form) => {
    const source = readFileSync(form.file, 'utf8');
    const pairs = [...source.matchAll(/(?<![:\w-])label="([^"]+)"[^>]*?(?<![:\w-])path="([^"]+)"/g)];
    expect(pairs.length).toBeGreaterThan(3);
    for (const [, label, path = ''] of pairs) {
      // A herd field shown on another form is labelled in the herd table.
      const table = path.startsWith('herd.') ? HERD_LABELS : form.table;
      expect(table[path.replace(/^herd\./, '')] ?? form.table[path], path).toBe(label);
    }
  });

  it('turns an unknown field into words rather than a path', () => {
    expect(fieldLabel('scenario.risk.seedValue')).toBe('Seed value');
  });
});

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? files(path) : /\.(vue|ts)$/.test(name) ? [path] : [];
  });
}

describe('one place for error wording', () => {
  it('no screen, component or store shows an ApiError message itself', () => {
    const offenders = files('src')
      .filter((path) => !path.startsWith(join('src', 'api')))
      .filter((path) => /ApiError \? \w+\.message|error\.message\b(?!\))/.test(readFileSync(path, 'utf8').replace(/instanceof Error \? error\.message/g, '')));
    expect(offenders).toEqual([]);
  });
});
