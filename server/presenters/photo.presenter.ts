import { photoUrl } from '../../shared/constants/media';
import type { PhotoDto } from '../../shared/types/journal';
import type { journalPhotos } from '../db/schema';

/** Turns a photo row into its DTO with the URLs of its WebP renditions. */
export function presentPhoto(row: typeof journalPhotos.$inferSelect): PhotoDto {
  const widths = row.widths
    .split(',')
    .map(Number)
    .filter((w) => Number.isFinite(w) && w > 0)
    .sort((a, b) => a - b);
  return {
    id: row.id,
    caption: row.caption,
    width: row.width,
    height: row.height,
    position: row.position,
    sources: widths.map((width) => ({ width, url: photoUrl(row.fileKey, width) })),
  };
}
