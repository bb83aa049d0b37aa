import { Router, type Request } from 'express';
import { rateLimit } from 'express-rate-limit';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { loginRequest, signupRequest } from '@shared/contracts/auth';
import { AppError, unauthenticated } from '../http/app-error';
import type { SessionUser } from '../http/auth-middleware';
import { parseBody } from '../http/validate';
import type { AuthService } from './auth-service';

// passport 0.7's req.login regenerates the session id, so a planted id is never promoted (session fixation).
function logIn(req: Request, user: SessionUser): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
}

const tooMany = (message: string) => () => {
  throw new AppError('rate_limited', 429, message);
};

export interface SignInLimits {
  perAccount: number;
  perAddress: number;
  windowMs: number;
}

export function createPassport(auth: AuthService): InstanceType<typeof Passport> {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      auth.verify(email, password).then((user) => done(null, user ?? false), done);
    }),
  );
  passport.serializeUser<number>((user, done) => done(null, user.id));
  passport.deserializeUser<number>((id, done) => {
    auth.users.findById(id).then((row) => done(null, row ? { id: row.id, email: row.email, name: row.name } : false), done);
  });
  return passport;
}

export function authRouter(auth: AuthService, passport: InstanceType<typeof Passport>, limits: SignInLimits): Router {

  const perAddress = rateLimit({
    windowMs: limits.windowMs,
    limit: limits.perAddress,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: tooMany('Too many sign-in attempts from this address; wait a few minutes and try again'),
  });
  const perAccount = rateLimit({
    windowMs: limits.windowMs,
    limit: limits.perAccount,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `account:${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler: tooMany('Too many sign-in attempts for this account; wait a few minutes and try again'),
  });

  const router = Router();

  router.post('/login', perAddress, perAccount, (req, res, next) => {
    req.body = parseBody(loginRequest, req);
    passport.authenticate('local', (error: unknown, user: SessionUser | false) => {
      if (error) return next(error);
      if (!user) {
        return next(new AppError('bad_credentials', 401, 'Wrong e-mail or password', [{ path: ['password'], message: 'Wrong e-mail or password' }]));
      }
      logIn(req, user)
        .then(() => auth.me(user))
        .then((me) => res.json(me), next);
    })(req, res, next);
  });

  router.post('/signup', perAddress, async (req, res) => {
    const user = await auth.signup(parseBody(signupRequest, req));
    await logIn(req, user);
    res.status(201).json(await auth.me(user));
  });

  router.post('/logout', (req, res, next) => {
    req.logout((error) => {
      if (error) return next(error);
      req.session.destroy((err) => {
        if (err) return next(err);
        res.clearCookie('kerfcast.sid');
        res.status(204).end();
      });
    });
  });

  router.get('/me', async (req, res) => {
    if (!req.user) throw unauthenticated();
    res.json(await auth.me(req.user));
  });

  return router;
}
