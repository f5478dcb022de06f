import type { PhotoDto } from '@shared/types/journal';
import { ApiError, getCsrfToken, http, resetCsrfToken, type ApiErrorBody } from './http';

/** Upload progress, 0 to 1 (bytes sent over bytes to send). */
export type ProgressHandler = (fraction: number) => void;

const photosPath = (journalId: number) => `/api/journals/${journalId}/photos`;

/**
 * Uploads photos (multipart field "photos", one caption per file in "captions"). Sent with
 * XMLHttpRequest because fetch cannot report upload progress.
 */
export async function uploadPhotos(
  journalId: number,
  files: File[],
  captions: string[] = [],
  onProgress?: ProgressHandler,
  signal?: AbortSignal,
): Promise<PhotoDto[]> {
  const form = new FormData();
  files.forEach((file) => form.append('photos', file));
  captions.forEach((caption) => form.append('captions', caption));
  try {
    return await send(journalId, form, await getCsrfToken(), onProgress, signal);
  } catch (error) {
    // The session changed since the token was fetched: fetch a new one and try once more.
    if (!(error instanceof ApiError) || error.code !== 'CSRF_INVALID') throw error;
    resetCsrfToken();
    return send(journalId, form, await getCsrfToken(), onProgress, signal);
  }
}

function send(
  journalId: number,
  form: FormData,
  token: string,
  onProgress?: ProgressHandler,
  signal?: AbortSignal,
): Promise<PhotoDto[]> {
  return new Promise<PhotoDto[]>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', photosPath(journalId));
    xhr.setRequestHeader('accept', 'application/json');
    xhr.setRequestHeader('x-csrf-token', token);
    xhr.withCredentials = true;
    xhr.responseType = 'json';
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && onProgress) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      const body = xhr.response as ({ photos?: PhotoDto[] } & ApiErrorBody) | null;
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress?.(1);
        resolve(body?.photos ?? []);
        return;
      }
      const err = body?.error;
      reject(
        new ApiError(
          xhr.status,
          err?.code ?? 'HTTP_ERROR',
          err?.message ?? `The server answered ${xhr.status}.`,
          err?.fields,
        ),
      );
    };
    xhr.onerror = () =>
      reject(new ApiError(0, 'NETWORK', 'The upload did not reach the server. Try again.'));
    xhr.onabort = () => reject(new DOMException('Upload cancelled', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

/** Changes a photo's caption. */
export const updatePhotoCaption = (journalId: number, photoId: number, caption: string) =>
  http.patch<{ photo?: PhotoDto }>(`${photosPath(journalId)}/${photoId}`, { caption });

/** Deletes a photo and its files. */
export const deletePhoto = (journalId: number, photoId: number) =>
  http.delete<void>(`${photosPath(journalId)}/${photoId}`);

/** Saves the order of a journal's photos, first one the cover. */
export const reorderPhotos = (journalId: number, ids: number[]) =>
  http.put<{ photos?: PhotoDto[] }>(`${photosPath(journalId)}/order`, { ids });
