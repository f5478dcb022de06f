import { Router, type Request } from 'express';
import {
  changePasswordSchema,
  deleteMeSchema,
  forgotPasswordSchema,
  resetPasswordSchema,
  signInSchema,
  signUpSchema,
  updateMeSchema,
  verifySchema,
} from '../../shared/schemas/auth';
import type { AppContext } from '../context';
import { csrfTokenFor } from '../middleware/csrf';
import { currentMember, requireMember } from '../middleware/authenticate';
import { validate, valid } from '../middleware/validate';
import { SESSION_COOKIE } from '../middleware/session';
import { presentMe } from '../presenters/member.presenter';
import { destroySession, regenerateSession, saveSession } from '../lib/session-helpers';
import * as auth from '../services/auth.service';

const clientIp = (req: Request) => req.ip ?? req.socket.remoteAddress ?? 'unknown';

/** /api/auth: sign-up, verification, sign-in and out, password reset, the member's settings. */
export function authRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/csrf', async (req, res) => {
    const token = csrfTokenFor(req);
    await saveSession(req);
    res.setHeader('Cache-Control', 'no-store');
    res.json({ token });
  });

  router.post('/signup', validate('body', signUpSchema), async (req, res) => {
    await auth.signUp(ctx, valid(res, 'body', signUpSchema), clientIp(req));
    res.status(202).json({ ok: true, message: auth.SIGN_UP_ANSWER });
  });

  router.post('/verify', validate('body', verifySchema), async (req, res) => {
    const user = await auth.verifyEmail(ctx, valid(res, 'body', verifySchema).token);
    res.json({ ok: true, message: 'Your e-mail address is confirmed.', email: user.email });
  });

  router.post('/verify/resend', requireMember, async (req, res) => {
    const outcome = await auth.resendVerification(ctx, currentMember(req).id, clientIp(req));
    res.json({
      ok: true,
      message:
        outcome === 'already'
          ? 'Your e-mail is already confirmed.'
          : 'A new confirmation link is on its way.',
    });
  });

  router.post('/signin', validate('body', signInSchema), async (req, res) => {
    const user = await auth.signIn(ctx, valid(res, 'body', signInSchema), clientIp(req));
    await regenerateSession(req); // a new id at sign-in: no session fixation
    req.session.userId = user.id;
    req.session.signedInAt = Date.now();
    csrfTokenFor(req);
    await saveSession(req);
    res.json({ member: presentMe(user), csrfToken: req.session.csrfToken });
  });

  router.post('/signout', async (req, res) => {
    const userId = req.session?.userId;
    if (userId) await auth.endAllSessions(ctx, userId);
    await destroySession(req);
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.status(204).end();
  });

  // The client's start-up check: 200 with member null for visitors, so a signed-out page load
  // is not an error in the browser console.
  router.get('/session', (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json({ member: req.member ? presentMe(req.member) : null });
  });

  router.get('/me', requireMember, (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json({ member: presentMe(currentMember(req)) });
  });

  router.patch('/me', requireMember, validate('body', updateMeSchema), async (req, res) => {
    const { user, pendingEmail } = await auth.updateMe(
      ctx,
      currentMember(req).id,
      valid(res, 'body', updateMeSchema),
    );
    res.json({
      member: presentMe(user),
      ...(pendingEmail
        ? {
            message: `We sent a confirmation link to ${pendingEmail}. Your e-mail changes once you open it.`,
          }
        : {}),
    });
  });

  router.delete('/me', requireMember, validate('body', deleteMeSchema), async (req, res) => {
    await auth.deleteAccount(
      ctx,
      currentMember(req).id,
      valid(res, 'body', deleteMeSchema).password,
    );
    await destroySession(req);
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.status(204).end();
  });

  router.post('/password/forgot', validate('body', forgotPasswordSchema), async (req, res) => {
    await auth.forgotPassword(ctx, valid(res, 'body', forgotPasswordSchema).email, clientIp(req));
    res.status(202).json({ ok: true, message: auth.FORGOT_ANSWER });
  });

  router.post('/password/reset', validate('body', resetPasswordSchema), async (req, res) => {
    await auth.resetPassword(ctx, valid(res, 'body', resetPasswordSchema), clientIp(req));
    res.json({ ok: true, message: 'Your password is changed. Sign in with the new one.' });
  });

  router.patch(
    '/password',
    requireMember,
    validate('body', changePasswordSchema),
    async (req, res) => {
      await auth.changePassword(
        ctx,
        currentMember(req).id,
        valid(res, 'body', changePasswordSchema),
        req.sessionID,
      );
      res.json({
        ok: true,
        message: 'Your password is changed. Your other sessions were signed out.',
      });
    },
  );

  return router;
}
