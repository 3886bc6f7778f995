/**
 * Toasts go to the half of the screen the pressed control is not in, so a "Saved" never covers
 * the button just pressed (docs/design.md, Habits: "every save says it saved").
 */
import { describe, expect, it } from 'vitest';
import { placementAwayFrom } from '../../../src/composables/useToastPlacement.js';

describe('toast placement', () => {
  it('puts the toast at the top for a button in the lower half (a sticky save bar)', () => {
    expect(placementAwayFrom({ top: 840, bottom: 880 }, 900)).toBe('top-right');
  });

  it('puts the toast at the bottom for a button in the upper half (the workspace Save)', () => {
    expect(placementAwayFrom({ top: 80, bottom: 120 }, 900)).toBe('bottom-right');
  });

  it('decides by the button’s middle: one straddling the middle line but mostly below goes with the lower half', () => {
    expect(placementAwayFrom({ top: 440, bottom: 480 }, 900)).toBe('top-right');
    expect(placementAwayFrom({ top: 420, bottom: 460 }, 900)).toBe('bottom-right');
  });
});
