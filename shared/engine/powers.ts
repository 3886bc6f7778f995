/**
 * (1 + rate)^t for whole t ≥ 0, remembered for the last rate asked for. A Monte Carlo run grows
 * and discounts every option of every draw at the same few rates, and the power is most of what
 * those loops cost; the same expression gives the same doubles, so every figure stays as it was.
 * Each caller keeps its own table, so a discount rate and a growth rate do not push each other out.
 */
export function powerTable(): (rate: number, t: number) => number {
  let tableRate = Number.NaN;
  const powers: number[] = [];
  return (rate, t) => {
    if (!Number.isInteger(t) || t < 0 || t > MAX_REMEMBERED) return (1 + rate) ** t;
    if (!Object.is(rate, tableRate)) {
      tableRate = rate;
      powers.length = 0;
    }
    for (let k = powers.length; k <= t; k++) powers.push((1 + rate) ** k);
    return powers[t] as number;
  };
}

// Horizons are at most a few decades; longer exponents are computed each time.
const MAX_REMEMBERED = 200;
