// What the "At the vat" view asks of the journal routes: the journal, the whole-document
// replace, and readings stored once by their client-made id (a replay answers 200).

import type { JournalInput } from '@shared/schemas/journal';
import type { JournalDto, ReadingDto } from '@shared/types/journal';
import type { VatReadingInput } from '../lib/vat/readings';
import { http } from './http';

/** One journal with its readings and derived figures; 404 when missing or not visible. */
export const fetchVatJournal = (id: number) => http.get<JournalDto>(`/api/journals/${id}`);

/**
 * Replaces the journal's whole document (owner only) if it is still at `version`; vat
 * readings and photos stay. A 409 JOURNAL_CHANGED carries the journal as it is now.
 */
export const putVatJournal = (id: number, doc: JournalInput, version: string) =>
  http.put<JournalDto>(`/api/journals/${id}`, doc, { 'if-match': `"${version}"` });

/** Stores one reading: 201 the first time, 200 with the stored reading on a replay. */
export const postReading = (id: number, reading: VatReadingInput) =>
  http.post<ReadingDto>(`/api/journals/${id}/readings`, reading);

/** Stores readings queued while offline, each once by id; answers them and how many were new. */
export const postReadings = (id: number, readings: VatReadingInput[]) =>
  http.post<{ readings: ReadingDto[]; created: number }>(`/api/journals/${id}/readings/batch`, {
    readings,
  });
