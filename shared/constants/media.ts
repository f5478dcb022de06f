/** Rendition widths of every stored photo, px (WebP). */
export const PHOTO_WIDTHS = [320, 960, 1920] as const;

/** Public URL path of one photo rendition. */
export const photoUrl = (fileKey: string, width: number) =>
  `/media/photos/${fileKey}-${width}.webp`;
