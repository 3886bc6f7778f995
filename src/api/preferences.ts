/** Preferences, decisions and the saved Monte Carlo result of a scenario. */
import type { MonteCarloResult } from '@shared/engine';
import type { Decision, Preference, PreferencesView, RiskResultView } from '@shared/responses';
import { http } from './client';

export type { Decision, Preference, PreferencesView };
/** The Monte Carlo result kept with a scenario. */
export type SavedRiskResult = RiskResultView;

const base = (farmId: number, scenarioId: number) => `/farms/${farmId}/scenarios/${scenarioId}`;

export const preferencesApi = {
  get: (farmId: number, scenarioId: number) => http.get<PreferencesView>(`${base(farmId, scenarioId)}/preferences`),
  record: (farmId: number, scenarioId: number, body: { optionId: string; reason: string }) =>
    http.put<PreferencesView>(`${base(farmId, scenarioId)}/preferences/me`, body),
  withdraw: (farmId: number, scenarioId: number) => http.delete<PreferencesView>(`${base(farmId, scenarioId)}/preferences/me`),
  decide: (farmId: number, scenarioId: number, body: { optionId: string; note: string }) =>
    http.post<PreferencesView>(`${base(farmId, scenarioId)}/decision`, body),
  /** null while no run has been kept for the scenario. */
  riskResult: (farmId: number, scenarioId: number) => http.get<SavedRiskResult | null>(`${base(farmId, scenarioId)}/risk-result`),
  keepRiskResult: (farmId: number, scenarioId: number, body: { scenarioVersion: number; result: MonteCarloResult }) =>
    http.put<SavedRiskResult>(`${base(farmId, scenarioId)}/risk-result`, body),
};
