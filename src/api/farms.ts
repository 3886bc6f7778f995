/** The caller's farms: list, create, and one farm's details. */
import type { CreateFarmInput } from '@shared/schema/accounts';
import type { FarmDetail, FarmSummary } from '@shared/responses';
import { http } from './client';

export type { FarmDetail, FarmSummary };

export const farmsApi = {
  list: () => http.get<FarmSummary[]>('/farms'),
  create: (input: CreateFarmInput) => http.post<FarmSummary>('/farms', input),
  get: (farmId: number) => http.get<FarmDetail>(`/farms/${farmId}`),
};
