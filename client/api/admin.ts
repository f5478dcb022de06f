import type { AdminUserDto, Page } from '@shared/types/admin';
import type { Role } from '@shared/types/member';
import { http } from './http';

export type DevMail = {
  id: number;
  to: string[];
  from: string;
  subject: string;
  text: string;
  html: string;
  date: string;
};

export const listMembers = (query: { q?: string; page?: number; pageSize?: number }) =>
  http.get<Page<AdminUserDto>>('/api/admin/users', query);

export const updateMember = (id: number, change: { role?: Role; disabled?: boolean }) =>
  http.patch<{ member: AdminUserDto }>(`/api/admin/users/${id}`, change);

/** Messages caught by the local mail fake (development and test servers only). */
export const listDevMail = () =>
  http.get<{ messages: DevMail[] }>('/api/dev/mail').then((r) => r.messages);
