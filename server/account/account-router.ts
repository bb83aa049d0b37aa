import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { passwordResetConfirm, passwordResetRequest, profilePatch } from '@shared/contracts/team';
import { AppError } from '../http/app-error';
import { requireAuth } from '../http/auth-middleware';
import { parseBody } from '../http/validate';
import type { AccountService } from './account-service';

const limited = (message: string) => () => {
  throw new AppError('rate_limited', 429, message);
};

// Mounted at /api/auth/password-reset: asking for a link, and using it.
export function passwordResetRouter(accounts: AccountService): Router {
  const router = Router();
  const windowMs = 15 * 60 * 1000;
  const perAddress = rateLimit({ windowMs, limit: 30, standardHeaders: 'draft-8', legacyHeaders: false, handler: limited('Too many reset requests from this address; wait a few minutes') });
  const perAccount = rateLimit({
    windowMs,
    limit: 3,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `reset:${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler: limited('Too many reset requests for this address; check your mail or wait a few minutes'),
  });

  router.post('/', perAddress, async (req, res, next) => {
    req.body = parseBody(passwordResetRequest, req);
    next();
  }, perAccount, (req, res) => {
    accounts.requestReset(req.body.email);
    res.status(202).json({ message: 'If an account exists for that address, a link to reset its password is on its way.' });
  });

  router.post('/:token', perAddress, async (req, res) => {
    const { password } = parseBody(passwordResetConfirm, req);
    await accounts.resetPassword(String(req.params['token']), password, req.sessionID);
    res.status(204).end();
  });

  return router;
}

// Mounted at /api/account: the signed-in user's own profile.
export function accountRouter(accounts: AccountService): Router {
  const router = Router();
  router.use(requireAuth);

  router.get('/profile', async (req, res) => {
    res.json(await accounts.profile(req.user!.id));
  });

  router.patch('/profile', async (req, res) => {
    res.json(await accounts.updateProfile(req.user!.id, parseBody(profilePatch, req)));
  });

  return router;
}
