import { CAPITAL_CATEGORY_LABELS } from '../capital-categories';
import type { Finance, Option } from '../schema';
import { roundCentsFast } from './cents';
import type { OptionPlan } from './projection';

/** One line of a sources-and-uses table (currency, cents). */
export interface FundsLine {
  key: string;
  label: string;
  amount: number;
}

/**
 * Where the money at year 0 goes and where it comes from (currency, cents): the totals agree to
 * the cent. The loan term is checked against the weighted life of what it finances.
 */
export interface SourcesAndUses {
  uses: FundsLine[];
  sources: FundsLine[];
  total: number;
  /** Capital-weighted useful life of the capital lines (years); null without capital. */
  weightedLifeYears: number | null;
  /** Set when the loan runs longer than that life: the last payments fall after the assets are worn out. */
  termPastLifeWarning: string | null;
}

const centsSum = (lines: readonly FundsLine[]): number => Math.round(lines.reduce((sum, line) => sum + line.amount * 100, 0)) / 100;

/** Capital by category in the order the categories are listed, contingency last (currency, cents). */
function capitalUses(option: Option, plan: OptionPlan): FundsLine[] {
  const categoryOf = new Map<string, string>();
  for (const line of option.capitalLines) categoryOf.set(line.id, line.kind === 'item' ? line.category : 'contingency');
  const byCategory = new Map<string, number>();
  for (const asset of plan.assets) {
    const category = categoryOf.get(asset.id) ?? 'other';
    byCategory.set(category, (byCategory.get(category) ?? 0) + asset.cost);
  }
  const order = [...Object.keys(CAPITAL_CATEGORY_LABELS), 'contingency'];
  return order
    .filter((category) => (byCategory.get(category) ?? 0) !== 0)
    .map((category) => ({
      key: `capital.${category}`,
      label: category === 'contingency' ? 'Contingency' : CAPITAL_CATEGORY_LABELS[category as keyof typeof CAPITAL_CATEGORY_LABELS],
      amount: roundCentsFast(byCategory.get(category) ?? 0),
    }));
}

/** Capital-weighted life (years) of the assets: Σ cost × life ÷ Σ cost; null without capital. */
export function weightedLifeYears(plan: Pick<OptionPlan, 'assets'>): number | null {
  let cost = 0;
  let weighted = 0;
  for (const asset of plan.assets) {
    cost += asset.cost;
    weighted += asset.cost * asset.lifeYears;
  }
  return cost > 0 ? weighted / cost : null;
}

/**
 * Sources and uses of an option's funds at year 0 (currency, cents). Uses: capital by category
 * (fees are the fee lines), cows bought for year 1, working capital for the first year's extra
 * feed in store (`feedStockMonths` ÷ 12 of year 1's feed above the current option's), interest
 * during construction. Sources: equity (the capital left after grants and the capital loan),
 * grants, the loan (with the interest during construction when capitalised), and other farm cash
 * for the rest (cows, feed stock, interest paid). Cows sold at year 0 are a source.
 */
export function sourcesAndUses(option: Option, plan: OptionPlan, finance: Finance, extraFeedYear1: number): SourcesAndUses {
  const uses = capitalUses(option, plan);
  const capital = centsSum(uses);
  const herd0 = roundCentsFast(plan.herdPurchasesByYear[0] ?? 0);
  if (herd0 > 0) uses.push({ key: 'cows', label: 'Cows bought for year 1', amount: herd0 });
  const feedStock = roundCentsFast((Math.max(0, extraFeedYear1) * finance.feedStockMonths) / 12);
  if (feedStock > 0) uses.push({ key: 'feed-stock', label: `Working capital: ${finance.feedStockMonths} months of the extra feed in store`, amount: feedStock });
  const interest = plan.interestDuringConstruction;
  if (interest > 0) uses.push({ key: 'construction-interest', label: `Interest during construction (${finance.constructionMonths} months, ${finance.interestDuringConstruction})`, amount: interest });

  const loan = roundCentsFast(plan.loanAmount);
  const capitalised = finance.interestDuringConstruction === 'capitalised' ? interest : 0;
  const grants = roundCentsFast(plan.grants);
  const sources: FundsLine[] = [];
  // Equity is what the capital needs beyond grants and the capital part of the loan.
  const equity = Math.round((capital - grants - (loan - capitalised)) * 100) / 100;
  if (equity !== 0) sources.push({ key: 'equity', label: 'Equity', amount: equity });
  if (grants > 0) sources.push({ key: 'grants', label: 'Grants', amount: grants });
  if (loan > 0) sources.push({ key: 'loan', label: capitalised > 0 ? 'Loan (interest during construction added)' : 'Loan', amount: loan });
  if (herd0 < 0) sources.push({ key: 'cows-sold', label: 'Cows sold before year 1', amount: -herd0 });
  const total = centsSum(uses);
  const other = Math.round((total - centsSum(sources)) * 100) / 100;
  if (other > 0) sources.push({ key: 'other', label: 'Other farm cash (cows, feed stock, interest paid)', amount: other });
  else if (other < 0) uses.push({ key: 'surplus', label: 'Cash left to the farm', amount: -other });

  const life = weightedLifeYears(plan);
  const warning =
    loan > 0 && life !== null && finance.termYears > life
      ? `The loan runs ${finance.termYears} years, past the ${life.toFixed(1)}-year weighted life of what it finances: the last payments fall after the assets are worn out.`
      : null;
  return { uses, sources, total: centsSum(uses), weightedLifeYears: life, termPastLifeWarning: warning };
}
