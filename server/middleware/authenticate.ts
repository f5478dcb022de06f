import type { RequestHandler } from 'express';
import type { AppContext } from '../context';
import { ForbiddenError, UnauthorizedError } from '../lib/errors';
import { findUserById } from '../repositories/users.repository';
import type { Role } from '../../shared/types/member';

export type AuthMember = {
  id: number;
  email: string;
  handle: string;
  displayName: string;
  role: Role;
  units: 'metric' | 'us';
  remindersEnabled: boolean;
  notifyComments: boolean;
  bio: string;
  emailVerified: boolean;
  createdAt: Date;
};

/** Loads the member of the session into req.member; a disabled or deleted one ends the session. */
export function authenticate(ctx: AppContext): RequestHandler {
  return async (req, _res, next) => {
    const userId = req.session?.userId;
    if (!userId) return next();
    const user = await findUserById(ctx.database.db, userId);
    if (!user || user.disabledAt) {
      delete req.session.userId;
      return next();
    }
    req.member = {
      id: user.id,
      email: user.email,
      handle: user.handle,
      displayName: user.displayName,
      role: user.role,
      units: user.units,
      remindersEnabled: user.remindersEnabled,
      notifyComments: user.notifyComments,
      bio: user.bio ?? '',
      emailVerified: user.emailVerifiedAt !== null,
      createdAt: user.createdAt,
    };
    next();
  };
}

/** 401 unless someone is signed in. */
export const requireMember: RequestHandler = (req, _res, next) => {
  if (!req.member) throw new UnauthorizedError();
  next();
};

/** 403 unless the member has confirmed their e-mail (needed to publish, comment and score). */
export const requireVerified: RequestHandler = (req, _res, next) => {
  if (!req.member) throw new UnauthorizedError();
  if (!req.member.emailVerified) {
    throw new ForbiddenError(
      'EMAIL_NOT_VERIFIED',
      'Please confirm your e-mail address first: we sent you a link. You can ask for a new one in your account settings.',
    );
  }
  next();
};

/** 403 unless the member has one of the roles. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.member) throw new UnauthorizedError();
    if (!roles.includes(req.member.role))
      throw new ForbiddenError('ROLE_REQUIRED', 'Your role does not allow this.');
    next();
  };
}

/** The signed-in member of a request that passed requireMember. */
export function currentMember(req: { member?: AuthMember }): AuthMember {
  if (!req.member) throw new UnauthorizedError();
  return req.member;
}
