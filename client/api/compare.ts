import type { CompareOutcomeKey, CompareParameterKey } from '@shared/constants/compare';
import type { HeatTreatment, RindTreatment, Species } from '@shared/constants/journal';
import type { CompareResultDto, SideBySideDto } from '@shared/types/compare';
import { http } from './http';

/** One comparison as the client asks for it: a parameter, an outcome and Discover's filters. */
export type CompareParams = {
  x: CompareParameterKey;
  y: CompareOutcomeKey;
  per: 'tasting' | 'journal';
  style?: string[];
  species?: Species[];
  heat?: HeatTreatment[];
  rind?: RindTreatment[];
  agingMin?: number;
  agingMax?: number;
  maker?: string;
};

function toQuery(params: CompareParams): Record<string, string> {
  const query: Record<string, string> = {};
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === null || value === '') continue;
    if (Array.isArray(value)) {
      if (value.length) query[key] = value.join(',');
    } else query[key] = String(value);
  }
  return query;
}

/** Relates a make parameter to an outcome over the journals the caller may read (SI values). */
export const fetchComparison = (params: CompareParams, signal?: AbortSignal) =>
  http.get<CompareResultDto>('/api/compare', toQuery(params), signal);

/** Two to four journals side by side; 404 when one of them is not visible to the caller. */
export const fetchSideBySide = (ids: number[], signal?: AbortSignal) =>
  http.get<SideBySideDto>('/api/compare/journals', { ids: ids.join(',') }, signal);
