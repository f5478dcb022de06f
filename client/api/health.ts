import { http } from './http';

/** Asks the server whether it and its database are up. */
export const fetchHealth = () => http.get<{ ok: boolean; db: 'up' | 'down' }>('/api/health');
