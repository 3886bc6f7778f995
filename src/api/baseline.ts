/** A farm's herd and market baseline: what new scenarios start from. Stored in SI units. */
import type { Herd } from '@shared/schema';
import type { UnitSystem } from '@shared/units';
import { http } from './client';

export interface FarmBaseline {
  /** Null until the baseline is first saved. */
  herd: Herd | null;
  currency: string;
  locale: string;
  units: UnitSystem;
}

export const baselineApi = {
  get: (farmId: number) => http.get<FarmBaseline>(`/farms/${farmId}/baseline`),
  save: (farmId: number, baseline: FarmBaseline & { herd: Herd }) => http.put<FarmBaseline>(`/farms/${farmId}/baseline`, baseline),
};

/** The farm itself as GET /api/farms/:farmId answers it. */
export interface FarmDetail {
  id: number;
  name: string;
  location: string;
  currency: string;
  locale: string;
  units: UnitSystem;
  role: 'owner' | 'partner' | 'consultant' | 'lender';
}

export const farmApi = {
  get: (farmId: number) => http.get<FarmDetail>(`/farms/${farmId}`),
};
