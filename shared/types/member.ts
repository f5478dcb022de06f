export type Role = 'member' | 'moderator' | 'admin';
export type UnitSystem = 'metric' | 'us';

/** The signed-in member, as /api/auth/me returns it. */
export type MeDto = {
  id: number;
  email: string;
  handle: string;
  displayName: string;
  role: Role;
  units: UnitSystem;
  remindersEnabled: boolean;
  /** E-mail me when someone comments on my journals. */
  notifyComments: boolean;
  /** The Markdown source of the profile bio. */
  bio: string;
  emailVerified: boolean;
  createdAt: string;
};
