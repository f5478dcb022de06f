// Readings logged at the vat: a temperature, a pH or both, with the time and the step.
// The id is made here, in the browser, so the server can store a replayed send only once.

import { readingInputSchema } from '@shared/schemas/journal';
import type { ReadingDto } from '@shared/types/journal';
import type { z } from 'zod';

export type VatReadingInput = z.output<typeof readingInputSchema>;

/** Returns a random version-4 UUID; crypto.randomUUID where the page is a secure context. */
export function newReadingId(cryptoApi: Crypto | undefined = globalThis.crypto): string {
  if (cryptoApi && typeof cryptoApi.randomUUID === 'function') return cryptoApi.randomUUID();
  // Plain http on a home network has no randomUUID, but getRandomValues works everywhere.
  const bytes = new Uint8Array(16);
  if (cryptoApi?.getRandomValues) cryptoApi.getRandomValues(bytes);
  else for (let i = 0; i < 16; i++) bytes[i] = Math.floor(Math.random() * 256);
  bytes[6] = (bytes[6] & 0x0f) | 0x40;
  bytes[8] = (bytes[8] & 0x3f) | 0x80;
  const hex = Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}

const pad = (n: number, width = 2) => String(Math.trunc(Math.abs(n))).padStart(width, '0');

/**
 * Returns an instant as ISO 8601 in the phone's local time with its UTC offset
 * ("2026-03-14T09:05:00.000+01:00"), so the journal keeps the maker's wall-clock time.
 */
export function isoWithOffset(ms: number, offsetMinutes = -new Date(ms).getTimezoneOffset()) {
  const local = new Date(ms + offsetMinutes * 60_000);
  const sign = offsetMinutes < 0 ? '-' : '+';
  const date = `${local.getUTCFullYear()}-${pad(local.getUTCMonth() + 1)}-${pad(local.getUTCDate())}`;
  const time = `${pad(local.getUTCHours())}:${pad(local.getUTCMinutes())}:${pad(local.getUTCSeconds())}.${pad(local.getUTCMilliseconds(), 3)}`;
  return `${date}T${time}${sign}${pad(offsetMinutes / 60)}:${pad(offsetMinutes % 60)}`;
}

export interface NewReading {
  tempC: number | null;
  ph: number | null;
  stepIndex: number | null;
  note?: string;
}

export type MakeReadingResult =
  | { ok: true; reading: VatReadingInput }
  | { ok: false; message: string; field: 'tempC' | 'ph' | 'note' };

/** Builds a reading taken `now`, checked with the shared schema the server uses. */
export function makeReading(input: NewReading, now: number, id = newReadingId()) {
  const parsed = readingInputSchema.safeParse({
    id,
    takenAt: isoWithOffset(now),
    tempC: input.tempC,
    ph: input.ph,
    stepIndex: input.stepIndex,
    note: input.note ?? '',
  });
  if (parsed.success) return { ok: true, reading: parsed.data } satisfies MakeReadingResult;
  const issue = parsed.error.issues[0];
  const field = issue?.path[0] === 'ph' ? 'ph' : issue?.path[0] === 'note' ? 'note' : 'tempC';
  return {
    ok: false,
    message: issue?.message ?? 'That reading cannot be saved.',
    field,
  } satisfies MakeReadingResult;
}

/** A reading as the page lists it, with whether the server has it yet. */
export interface VatReading extends ReadingDto {
  pending: boolean;
}

/**
 * Merges what the server has with what this browser logged (sent or still queued), once per
 * id, oldest first. A reading both on the server and in the queue is not pending any more.
 */
export function mergeReadings(
  server: readonly ReadingDto[],
  local: readonly VatReadingInput[],
  queuedIds: ReadonlySet<string>,
): VatReading[] {
  const byId = new Map<string, VatReading>();
  for (const r of server) byId.set(r.id, { ...r, pending: false });
  for (const r of local) {
    if (byId.has(r.id)) continue;
    byId.set(r.id, { ...r, pending: queuedIds.has(r.id) });
  }
  return [...byId.values()].sort((a, b) => Date.parse(a.takenAt) - Date.parse(b.takenAt));
}
