import { Router, type Request, type Response } from 'express';
import type { createPassport } from '../auth/passport';
import {
  acceptInvitationSchema,
  loginSchema,
  resetConfirmSchema,
  resetRequestSchema,
  tokenSchema,
  type User,
} from '../../shared/schemas/auth';
import type { AppDeps } from '../deps';
import { AppError } from '../errors';
import { createRateLimits } from '../middleware/rate-limits';
import { parseInput } from '../middleware/validate';
import { acceptInvitation, confirmPasswordReset, describeInvitation, requestPasswordReset } from '../services/auth';

export function authRoutes(deps: AppDeps, passport: ReturnType<typeof createPassport>, csrfToken: (req: Request, res: Response) => string) {
  const r = Router();

  const limits = createRateLimits();

  r.get('/csrf', (req, res) => {
    res.json({ csrfToken: csrfToken(req, res) });
  });

  r.get('/me', (req, res) => {
    // localMail: the Outbox screen exists only while mails go to the local fake
    res.json({ user: req.user ?? null, localMail: deps.mailer.usesLocalFake });
  });

  r.post('/login', ...limits.login, (req, res, next) => {
    parseInput(loginSchema, req.body, 'The sign-in');
    passport.authenticate('local', (err: unknown, user: User | false) => {
      if (err) return next(err);
      if (!user) return next(new AppError('unauthenticated', 'Wrong e-mail or password, or the account is deactivated'));
      // passport >= 0.6 regenerates the session id here, which defeats session fixation
      // the signed-in session gets a new CSRF cookie (GET /csrf returns it); the old token stops working
      req.login(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        csrfToken(req, res);
        // localMail as /me gives it, so the nav (the Outbox link) is whole at once after sign-in
        res.json({ user, localMail: deps.mailer.usesLocalFake });
      });
    })(req, res, next);
  });

  r.post('/logout', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy((destroyErr) => {
        if (destroyErr) return next(destroyErr);
        res.clearCookie('ft.sid', { path: '/' });
        res.json({ ok: true });
      });
    });
  });

  r.get('/invitations/:token', async (req, res) => {
    const token = parseInput(tokenSchema, req.params.token, 'The link');
    res.json({ invitation: await describeInvitation(deps, token) });
  });

  r.post('/invitations/accept', async (req, res, next) => {
    const input = parseInput(acceptInvitationSchema, req.body, 'The invitation');
    const user = await acceptInvitation(deps, input);
    req.login(user, (err) => {
      if (err) return next(err);
      csrfToken(req, res);
      res.status(201).json({ user, localMail: deps.mailer.usesLocalFake });
    });
  });

  r.post('/password-reset', ...limits.resetMail, async (req, res) => {
    const { email } = parseInput(resetRequestSchema, req.body, 'The reset request');
    await requestPasswordReset(deps, email);
    res.status(202).json({ ok: true, message: 'If that address has an account, a reset link is on its way.' });
  });

  r.post('/password-reset/confirm', async (req, res) => {
    await confirmPasswordReset(deps, parseInput(resetConfirmSchema, req.body, 'The new password'));
    res.json({ ok: true });
  });

  return r;
}
