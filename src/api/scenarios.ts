/** Scenarios of one farm: list, read, save with optimistic locking, versions and their comparison. */
import type { ScenarioInput } from '@shared/schema';
import type { z } from 'zod';
import type { createScenarioBodySchema } from '@shared/schema/requests';
import type {
  ResultsDetailView,
  ScenarioListItem,
  ScenarioMeta,
  ScenarioStatus,
  ScenarioView,
  VersionComparison,
  VersionConflict,
  VersionListItem,
  VersionView,
} from '@shared/responses';
import { http } from './client';

export type { ResultsDetailView, ScenarioListItem, ScenarioMeta, ScenarioStatus, VersionComparison, VersionConflict, VersionListItem };
/** A scenario with its version and results, as GET S and every save answer. */
export type ScenarioDocument = ScenarioView;
/** A past version, read-only, with its results. */
export type VersionDocument = VersionView;

export type CreateScenarioBody = z.input<typeof createScenarioBodySchema>;

const base = (farmId: number) => `/farms/${farmId}/scenarios`;

export const scenariosApi = {
  list: (farmId: number) => http.get<ScenarioListItem[]>(base(farmId)),
  /** A new scenario from the farm baseline, with one current option from a starting point. */
  create: (farmId: number, body: CreateScenarioBody) => http.post<ScenarioDocument & { id: number }>(base(farmId), body),
  /** A new scenario from a whole document (an import, or "keep my copy" after a conflict). */
  createFrom: (farmId: number, scenario: ScenarioInput, name?: string) =>
    http.post<ScenarioDocument & { id: number }>(base(farmId), name ? { scenario, name } : { scenario }),
  get: (farmId: number, id: number) => http.get<ScenarioDocument>(`${base(farmId)}/${id}`),
  /** Each option's yearly lines and loan payments, which `get` leaves out; at `version`, or the one the caller sees. */
  resultsDetail: (farmId: number, id: number, version?: number) =>
    http.get<ResultsDetailView>(`${base(farmId)}/${id}/results/detail${version === undefined ? '' : `?version=${version}`}`),
  save: (farmId: number, id: number, body: { version: number; scenario: ScenarioInput; note?: string }) =>
    http.put<ScenarioDocument>(`${base(farmId)}/${id}`, body),
  duplicate: (farmId: number, id: number) => http.post<ScenarioDocument & { id: number }>(`${base(farmId)}/${id}/duplicate`),
  archive: (farmId: number, id: number) => http.post<unknown>(`${base(farmId)}/${id}/archive`),
  remove: (farmId: number, id: number) => http.delete(`${base(farmId)}/${id}`),
  versions: (farmId: number, id: number) => http.get<VersionListItem[]>(`${base(farmId)}/${id}/versions`),
  version: (farmId: number, id: number, version: number) => http.get<VersionDocument>(`${base(farmId)}/${id}/versions/${version}`),
  compare: (farmId: number, id: number, from: number, to: number) =>
    http.get<VersionComparison>(`${base(farmId)}/${id}/versions/compare?from=${from}&to=${to}`),
  restore: (farmId: number, id: number, version: number) =>
    http.post<ScenarioDocument>(`${base(farmId)}/${id}/versions/${version}/restore`),
  exportUrl: (farmId: number, id: number) => `/api${base(farmId)}/${id}/export.json`,
};
