/**
 * The fixed colour of each option on every chart and legend: the Okabe–Ito colour-blind-safe
 * set (Okabe & Ito, "Color Universal Design", 2008), in an order that keeps neighbours far
 * apart for the common forms of colour blindness (its yellow darkened to olive to read on white),
 * by the option's place in its scenario.
 * Lines also get a dash pattern so colour is never the only cue.
 */
export const OPTION_COLOURS = ['#0072B2', '#E69F00', '#009E73', '#CC79A7', '#D55E00', '#56B4E9', '#7a6a00', '#26323a'] as const;

const DASHES = [0, 6, 2, 8, 4] as const;

/** Colour (hex) of the option at `index` in the scenario's option list; wraps after eight. */
export function optionColour(index: number): string {
  const i = ((index % OPTION_COLOURS.length) + OPTION_COLOURS.length) % OPTION_COLOURS.length;
  return OPTION_COLOURS[i] ?? OPTION_COLOURS[0];
}

/** Dash length (px, 0 = solid) for the option's line at `index`. */
export function optionDash(index: number): number {
  return DASHES[index % DASHES.length] ?? 0;
}

/** Colour per option id, from the scenario's option order. */
export function useOptionColours(optionIds: readonly string[]): { colourOf(id: string): string; dashOf(id: string): number } {
  const order = new Map(optionIds.map((id, i) => [id, i]));
  return {
    colourOf: (id) => optionColour(order.get(id) ?? 0),
    dashOf: (id) => optionDash(order.get(id) ?? 0),
  };
}
