import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import * as engine from '../../../shared/engine';

const root = join(__dirname, '../../..');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return name === 'engine' && dir.endsWith('shared') ? [] : sourceFiles(path);
    return /\.(ts|vue)$/.test(name) ? [path] : [];
  });
}

describe('the engine surface (shared/engine/README.md "Layout")', () => {
  it('is the only way into the engine from screens, the server and the rest of shared', () => {
    // docs/layout.md: one home per thing; shared/engine/index.ts names what callers may use.
    const deep = /from\s+'(?:@shared\/|(?:\.\.?\/)+(?:shared\/)?)engine\/(?!index\.js')[^']+'/;
    const offenders = ['src', 'server', 'shared']
      .flatMap((dir) => sourceFiles(join(root, dir)))
      .filter((file) => deep.test(readFileSync(file, 'utf8')))
      .map((file) => relative(root, file));
    expect(offenders).toEqual([]);
  });

  it('names the evaluation, risk and finance functions callers use', () => {
    for (const name of ['evaluateScenario', 'evaluateNpvOnly', 'anchoredForShocks', 'runMonteCarlo', 'prepareMonteCarlo', 'runMonteCarloBlocks', 'mergeMonteCarloSamples', 'sensitivity', 'presentValue', 'signChanges', 'discount', 'cumulative']) {
      expect(typeof (engine as Record<string, unknown>)[name], name).toBe('function');
    }
  });
});
