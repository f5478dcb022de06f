import type { z } from 'zod';
import { assessPassword } from '../../shared/security/password-strength';
import type {
  changePasswordSchema,
  resetPasswordSchema,
  signInSchema,
  signUpSchema,
  updateMeSchema,
} from '../../shared/schemas/auth';
import type { AppContext } from '../context';
import { AppError, ConflictError, ForbiddenError, ValidationError } from '../lib/errors';
import { hashPassword, verifyPassword } from '../lib/passwords';
import { clearPoints, ensureNotLimited, takePoint } from '../lib/rate-limit';
import { hashToken, newToken } from '../lib/tokens';
import { mailTemplates } from '../mail/templates';
import type { OutgoingMail } from '../mail/mailer';
import {
  consumeEmailToken,
  findLiveEmailToken,
  issueEmailToken,
} from '../repositories/email-tokens.repository';
import { deleteSessionsOfUser } from '../repositories/sessions.repository';
import {
  countActiveAdmins,
  deleteUser,
  findUserByEmail,
  findUserByHandle,
  findUserById,
  insertUser,
  updateUser,
  type UserRow,
} from '../repositories/users.repository';
import { removeMemberContent } from './member-content.service';

const HOUR = 60 * 60 * 1000;
const VERIFY_TTL = 48 * HOUR;
const RESET_TTL = 30 * 60 * 1000;
const EMAIL_CHANGE_TTL = 24 * HOUR;

/** The answer to sign-up, identical whether or not the e-mail already has an account. */
export const SIGN_UP_ANSWER =
  'Thanks for joining. We sent a confirmation link to that address: open it to finish. You can sign in meanwhile.';
/** The answer to "forgot password", identical whether or not the e-mail has an account. */
export const FORGOT_ANSWER =
  'If that address belongs to an account, a link to choose a new password is on its way. It works once, for 30 minutes.';
const INVALID_CREDENTIALS = 'That e-mail and password do not match an account.';

let dummyHash: Promise<string> | null = null;

async function sendQuietly(ctx: AppContext, mail: OutgoingMail): Promise<void> {
  try {
    await ctx.mailer.send(mail);
  } catch {
    // already logged by the mailer; the member can ask for the link again
  }
}

function rejectWeakPassword(password: string, inputs: string[], field: string): void {
  const verdict = assessPassword(password, inputs);
  if (!verdict.acceptable) throw new ValidationError({ [field]: verdict.hint });
}

const link = (ctx: AppContext, path: string, token: string) =>
  `${ctx.config.publicUrl}${path}?token=${encodeURIComponent(token)}`;

async function sendVerification(
  ctx: AppContext,
  user: Pick<UserRow, 'id' | 'email' | 'displayName'>,
): Promise<void> {
  const { token, hash } = newToken();
  await issueEmailToken(ctx.database.db, {
    userId: user.id,
    kind: 'verify',
    tokenHash: hash,
    expiresAt: new Date(Date.now() + VERIFY_TTL),
  });
  await sendQuietly(
    ctx,
    mailTemplates.verifyEmail(user.email, user.displayName, link(ctx, '/verify', token)),
  );
}

const isDuplicate = (error: unknown, index: string) => {
  const e = error as {
    code?: string;
    message?: string;
    cause?: { code?: string; message?: string };
  };
  const code = e.code ?? e.cause?.code;
  const message = `${e.message ?? ''} ${e.cause?.message ?? ''}`;
  return code === 'ER_DUP_ENTRY' && message.includes(index);
};

/** Creates an account and mails a verification link; an existing e-mail gets a notice instead. */
export async function signUp(
  ctx: AppContext,
  input: z.infer<typeof signUpSchema>,
  ip: string,
): Promise<void> {
  await takePoint(ctx.limiters.signUpIp, ip);
  rejectWeakPassword(input.password, [input.email, input.handle, input.displayName], 'password');
  const passwordHash = await hashPassword(input.password); // before the look-up: same timing either way
  const db = ctx.database.db;
  const existing = await findUserByEmail(db, input.email);
  if (existing) {
    await sendQuietly(
      ctx,
      mailTemplates.signUpAttemptOnExisting(
        existing.email,
        existing.displayName,
        `${ctx.config.publicUrl}/signin`,
        `${ctx.config.publicUrl}/forgot`,
      ),
    );
    return;
  }
  if (await findUserByHandle(db, input.handle)) {
    throw new ConflictError('HANDLE_TAKEN', 'That handle is taken.', {
      handle: 'That handle is taken. Try another.',
    });
  }
  let id: number;
  try {
    id = await insertUser(db, {
      email: input.email,
      handle: input.handle,
      displayName: input.displayName,
      passwordHash,
    });
  } catch (error) {
    if (isDuplicate(error, 'users_handle_unique')) {
      throw new ConflictError('HANDLE_TAKEN', 'That handle is taken.', {
        handle: 'That handle is taken. Try another.',
      });
    }
    if (isDuplicate(error, 'users_email_unique')) return; // a racing sign-up with the same e-mail
    throw error;
  }
  await sendVerification(ctx, { id, email: input.email, displayName: input.displayName });
}

/** Confirms an e-mail from a verification or e-mail-change link; resolves with the member. */
export async function verifyEmail(ctx: AppContext, token: string): Promise<UserRow> {
  const db = ctx.database.db;
  const hash = hashToken(token);
  const verify = await consumeEmailToken(db, 'verify', hash);
  if (verify) {
    await updateUser(db, verify.userId, { emailVerifiedAt: new Date() });
    return (await findUserById(db, verify.userId))!;
  }
  const change = await consumeEmailToken(db, 'email-change', hash);
  if (change?.newEmail) {
    if (await findUserByEmail(db, change.newEmail)) {
      throw new ConflictError('EMAIL_TAKEN', 'That e-mail address is now used by another account.');
    }
    await updateUser(db, change.userId, { email: change.newEmail, emailVerifiedAt: new Date() });
    return (await findUserById(db, change.userId))!;
  }
  throw new AppError(
    400,
    'TOKEN_INVALID',
    'This link has expired or was already used. Ask for a new one.',
  );
}

/** Mails a fresh verification link to a signed-in member who has not confirmed yet. */
export async function resendVerification(
  ctx: AppContext,
  userId: number,
  ip: string,
): Promise<'sent' | 'already'> {
  await takePoint(ctx.limiters.resendIp, ip);
  await takePoint(ctx.limiters.resendAccount, String(userId));
  const user = await findUserById(ctx.database.db, userId);
  if (!user) throw new ForbiddenError();
  if (user.emailVerifiedAt) return 'already';
  await sendVerification(ctx, user);
  return 'sent';
}

/** Checks e-mail and password; resolves with the member or throws the same 401 for any mismatch. */
export async function signIn(
  ctx: AppContext,
  input: z.infer<typeof signInSchema>,
  ip: string,
): Promise<UserRow> {
  await takePoint(ctx.limiters.signInIp, ip);
  await ensureNotLimited(ctx.limiters.signInAccount, input.email);
  const user = await findUserByEmail(ctx.database.db, input.email);
  let ok = false;
  if (user) ok = await verifyPassword(user.passwordHash, input.password);
  else {
    dummyHash ??= hashPassword('not-a-real-password-for-timing');
    await verifyPassword(await dummyHash, input.password);
  }
  ctx.logger.info({ event: 'sign-in', email: input.email, ip, ok }, 'sign-in attempt');
  if (!user || !ok) {
    await takePoint(ctx.limiters.signInAccount, input.email);
    throw new AppError(401, 'INVALID_CREDENTIALS', INVALID_CREDENTIALS);
  }
  if (user.disabledAt)
    throw new ForbiddenError(
      'ACCOUNT_DISABLED',
      'This account has been disabled. Contact the site admins.',
    );
  await clearPoints(ctx.limiters.signInAccount, input.email);
  return user;
}

/** Ends every stored session of the member (sign-out signs out everywhere). */
export async function endAllSessions(
  ctx: AppContext,
  userId: number,
  keepSessionId?: string,
): Promise<void> {
  await deleteSessionsOfUser(ctx.database.db, userId, keepSessionId);
}

/** Mails a single-use reset link (30 minutes) when the address has an account. */
export async function forgotPassword(ctx: AppContext, email: string, ip: string): Promise<void> {
  await takePoint(ctx.limiters.resetIp, ip);
  await takePoint(ctx.limiters.resetAccount, email);
  const user = await findUserByEmail(ctx.database.db, email);
  if (!user || user.disabledAt) return;
  const { token, hash } = newToken();
  await issueEmailToken(ctx.database.db, {
    userId: user.id,
    kind: 'reset',
    tokenHash: hash,
    expiresAt: new Date(Date.now() + RESET_TTL),
  });
  await sendQuietly(
    ctx,
    mailTemplates.resetPassword(user.email, user.displayName, link(ctx, '/reset', token)),
  );
}

/** Sets a new password from a reset link and ends every session of the member. */
export async function resetPassword(
  ctx: AppContext,
  input: z.infer<typeof resetPasswordSchema>,
  ip: string,
): Promise<void> {
  await takePoint(ctx.limiters.resetIp, ip);
  const db = ctx.database.db;
  const invalid = () =>
    new AppError(
      400,
      'TOKEN_INVALID',
      'This reset link has expired or was already used. Ask for a new one.',
    );
  const hash = hashToken(input.token);
  const live = await findLiveEmailToken(db, 'reset', hash);
  const user = live ? await findUserById(db, live.userId) : undefined;
  if (!live || !user) throw invalid();
  // Checked before the link is used up, so a refused password does not cost the member the link.
  rejectWeakPassword(input.password, [user.email, user.handle, user.displayName], 'password');
  if (!(await consumeEmailToken(db, 'reset', hash))) throw invalid();
  await updateUser(db, user.id, {
    passwordHash: await hashPassword(input.password),
    emailVerifiedAt: user.emailVerifiedAt ?? new Date(), // the link proved the mailbox
  });
  await endAllSessions(ctx, user.id);
}

/** Changes the password after checking the current one; other sessions end. */
export async function changePassword(
  ctx: AppContext,
  userId: number,
  input: z.infer<typeof changePasswordSchema>,
  currentSessionId: string,
): Promise<void> {
  const db = ctx.database.db;
  const user = await findUserById(db, userId);
  if (!user) throw new ForbiddenError();
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    throw new ValidationError({ currentPassword: 'That is not your current password.' });
  }
  rejectWeakPassword(input.newPassword, [user.email, user.handle, user.displayName], 'newPassword');
  await updateUser(db, userId, { passwordHash: await hashPassword(input.newPassword) });
  await endAllSessions(ctx, userId, currentSessionId);
  await sendQuietly(ctx, mailTemplates.passwordChanged(user.email, user.displayName));
}

/** Updates the member's settings; a new e-mail is only used once confirmed from its link. */
export async function updateMe(
  ctx: AppContext,
  userId: number,
  input: z.infer<typeof updateMeSchema>,
): Promise<{ user: UserRow; pendingEmail: string | null }> {
  const db = ctx.database.db;
  const user = await findUserById(db, userId);
  if (!user) throw new ForbiddenError();
  let pendingEmail: string | null = null;
  if (input.email && input.email !== user.email) {
    if (!(await verifyPassword(user.passwordHash, input.currentPassword ?? ''))) {
      throw new ValidationError({ currentPassword: 'That is not your current password.' });
    }
    pendingEmail = input.email;
    if (!(await findUserByEmail(db, input.email))) {
      const { token, hash } = newToken();
      await issueEmailToken(db, {
        userId,
        kind: 'email-change',
        tokenHash: hash,
        newEmail: input.email,
        expiresAt: new Date(Date.now() + EMAIL_CHANGE_TTL),
      });
      await sendQuietly(
        ctx,
        mailTemplates.confirmNewEmail(input.email, user.displayName, link(ctx, '/verify', token)),
      );
    }
  }
  const set: Partial<UserRow> = {};
  if (input.displayName !== undefined) set.displayName = input.displayName;
  if (input.units !== undefined) set.units = input.units;
  if (input.remindersEnabled !== undefined) set.remindersEnabled = input.remindersEnabled;
  if (input.notifyComments !== undefined) set.notifyComments = input.notifyComments;
  if (input.bio !== undefined) set.bio = input.bio;
  if (Object.keys(set).length) await updateUser(db, userId, set);
  return { user: (await findUserById(db, userId))!, pendingEmail };
}

/** Deletes the account after a password check: its content and files go with it. */
export async function deleteAccount(
  ctx: AppContext,
  userId: number,
  password: string,
): Promise<void> {
  const db = ctx.database.db;
  const user = await findUserById(db, userId);
  if (!user) throw new ForbiddenError();
  if (!(await verifyPassword(user.passwordHash, password))) {
    throw new ValidationError({ password: 'That is not your password.' });
  }
  if (user.role === 'admin') {
    if ((await countActiveAdmins(db)) <= 1) {
      throw new ConflictError(
        'LAST_ADMIN',
        'You are the only admin. Make another member admin before deleting your account.',
      );
    }
  }
  await removeMemberContent(ctx, userId);
  await deleteUser(db, userId);
  await endAllSessions(ctx, userId);
}
