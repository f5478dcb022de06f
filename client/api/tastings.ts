import type { TastingInput } from '@shared/schemas/tasting';
import type { AgeBandDto, TastingDto } from '@shared/types/tasting';
import { http } from './http';

/** Every tasting of a journal, with the mean scores per age band. */
export type JournalTastings = {
  tastings: TastingDto[];
  bands: AgeBandDto[];
  /** For the maker only: why invited tasters could not open the journal, or null. */
  invites?: { blockedReason: string | null };
};

/** A tasting invite: the link handed to friends at a meeting, and when it stops working. */
export type TastingInvite = { code: string; url: string; expiresAt: string };

/** The tastings of one journal the caller can read. */
export const listTastings = (journalId: number, signal?: AbortSignal) =>
  http.get<JournalTastings>(`/api/journals/${journalId}/tastings`, undefined, signal);

/** Adds a scorecard; a member who is not the maker sends the invite code in `invite`. */
export const createTasting = (journalId: number, input: TastingInput) =>
  http.post<{ tasting: TastingDto }>(`/api/journals/${journalId}/tastings`, input);

/** Changes part of a tasting (its taster, moderators, admins). */
export const updateTasting = (id: number, patch: Partial<Omit<TastingInput, 'invite'>>) =>
  http.patch<{ tasting: TastingDto }>(`/api/tastings/${id}`, patch);

/** Deletes a tasting (its taster, moderators, admins). */
export const deleteTasting = (id: number) => http.delete<void>(`/api/tastings/${id}`);

/** Makes a tasting invite for the maker's wheel. */
export const createInvite = (journalId: number) =>
  http.post<{ invite: TastingInvite }>(`/api/journals/${journalId}/invites`);
