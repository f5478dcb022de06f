import type { WeighInDto } from '@shared/types/journal';
import type { CaveWheelDto } from '@shared/types/tasting';
import { http } from './http';

/** The wheel statuses a maker can move a wheel to from the cave. */
export type CaveStatus = 'drying' | 'aging' | 'opened' | 'finished' | 'discarded';

/** The caller's wheels drying and aging. */
export const listCave = (signal?: AbortSignal) =>
  http.get<{ wheels: CaveWheelDto[] }>('/api/cave', undefined, signal);

/** Moves one of the caller's wheels to a new status. */
export const setWheelStatus = (journalId: number, wheelStatus: CaveStatus) =>
  http.post<void>(`/api/cave/${journalId}/status`, { wheelStatus });

/** Records a weigh-in on a wheel (mass in kg). The journals server owns the route. */
export const addWeighIn = (journalId: number, weighIn: WeighInDto) =>
  http.post<unknown>(`/api/journals/${journalId}/weigh-ins`, weighIn);

/** The caller's secret calendar address of ready dates. */
export const fetchCalendarUrl = () => http.get<{ url: string }>('/api/cave/calendar');

/** Makes a new secret calendar address; the old one stops working. */
export const resetCalendarUrl = () => http.post<{ url: string }>('/api/cave/calendar/reset');
