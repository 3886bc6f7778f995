import type { CreateFarmInput, FarmRole } from '@shared/schema/accounts';
import { http } from './client';

export interface FarmSummary {
  id: number;
  name: string;
  location: string;
  role: FarmRole;
  currency: string;
  units: 'metric' | 'us';
}

export const farmsApi = {
  list: () => http.get<FarmSummary[]>('/farms'),
  create: (input: CreateFarmInput) => http.post<FarmSummary>('/farms', input),
  get: (farmId: number) => http.get<FarmSummary>(`/farms/${farmId}`),
};
