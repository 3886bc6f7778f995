/** The US MACRS GDS percentage tables (IRS Publication 946) the tax classes use. */

export type MacrsTable = {
  readonly recoveryYears: number;
  readonly method: '200% declining balance' | '150% declining balance';
  readonly convention: 'half-year';
  /** Percent of the unadjusted basis deducted in tax years 1..recoveryYears + 1. */
  readonly percentages: readonly number[];
  readonly source: string;
};

/** US MACRS GDS 10-year property (single-purpose agricultural structures), 200 % DB, half-year. */
export const MACRS_10_YEAR_200DB: MacrsTable = {
  recoveryYears: 10,
  method: '200% declining balance',
  convention: 'half-year',
  percentages: [10.0, 18.0, 14.4, 11.52, 9.22, 7.37, 6.55, 6.55, 6.56, 6.55, 3.28],
  source: 'IRS Publication 946, Table A-1',
};

/** US MACRS GDS 10-year property, 150 % DB, half-year: farm property may elect 150 % DB (required before 2018, from memory). */
export const MACRS_10_YEAR_150DB: MacrsTable = {
  recoveryYears: 10,
  method: '150% declining balance',
  convention: 'half-year',
  percentages: [7.5, 13.88, 11.79, 10.02, 8.74, 8.74, 8.74, 8.74, 8.74, 8.74, 4.37],
  source: 'IRS Publication 946, Table A-14',
};

/** US MACRS GDS 20-year property (general farm buildings), 150 % DB, half-year. */
export const MACRS_20_YEAR_150DB: MacrsTable = {
  recoveryYears: 20,
  method: '150% declining balance',
  convention: 'half-year',
  percentages: [
    3.75, 7.219, 6.677, 6.177, 5.713, 5.285, 4.888, 4.522, 4.462, 4.461, 4.462, 4.461, 4.462, 4.461, 4.462,
    4.461, 4.462, 4.461, 4.462, 4.461, 2.231,
  ],
  source: 'IRS Publication 946, Table A-1',
};
