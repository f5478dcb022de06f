import type { StyleDto } from '@shared/types/style';
import { http } from './http';

/** Loads the reference list of cheese styles. */
export const fetchStyles = () =>
  http.get<{ styles: StyleDto[] }>('/api/styles').then((r) => r.styles);
