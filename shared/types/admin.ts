import type { Role } from './member';

export type AdminUserDto = {
  id: number;
  email: string;
  handle: string;
  displayName: string;
  role: Role;
  emailVerified: boolean;
  disabled: boolean;
  createdAt: string;
};

export type Page<T> = { items: T[]; total: number; page: number; pageSize: number };
