/** A farm's herd and market baseline: what new scenarios start from. Stored in SI units. */
import type { Herd } from '@shared/schema';
import type { FarmBaseline } from '@shared/responses';
import { http } from './client';

export type { FarmBaseline };

export const baselineApi = {
  get: (farmId: number) => http.get<FarmBaseline>(`/farms/${farmId}/baseline`),
  save: (farmId: number, baseline: FarmBaseline & { herd: Herd }) => http.put<FarmBaseline>(`/farms/${farmId}/baseline`, baseline),
};
