import { Router, type NextFunction, type Request, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { loginRequest, signupAnswerMessage, signupRequest, type SignupAnswer } from '@shared/contracts/auth';
import { AppError, unauthenticated } from '../http/app-error';
import type { SessionUser } from '../http/auth-middleware';
import { parseBody } from '../http/validate';
import type { AuthService } from './auth-service';
import { retryAfterHeader } from './retry-after';
import { SignInThrottle, type SignInLimits } from './sign-in-throttle';

export { defaultSignInLimits, type SignInLimits } from './sign-in-throttle';

// passport 0.7's req.login regenerates the session id, so a planted id is never promoted (session fixation).
function logIn(req: Request, user: SessionUser): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
}

const wrongPassword = () =>
  new AppError('bad_credentials', 401, 'Wrong e-mail or password', [{ path: ['password'], message: 'Wrong e-mail or password' }]);

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
  const throttle = new SignInThrottle(limits);
  const signupsPerAddress = rateLimit({
    windowMs: limits.windowMs,
    limit: limits.perAddress,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: () => {
      throw new AppError('rate_limited', 429, 'Too many sign-ups from this address; wait a few minutes and try again');
    },
  });
  const authenticate = (req: Request, res: Response, next: NextFunction) =>
    new Promise<SessionUser | false>((resolve, reject) => {
      passport.authenticate('local', (error: unknown, user: SessionUser | false) => (error ? reject(error) : resolve(user)))(req, res, next);
    });

  const router = Router();

  router.post('/login', async (req, res, next) => {
    const { email } = (req.body = parseBody(loginRequest, req));
    const address = req.ip ?? 'unknown';
    await throttle.waitTurn(address, email);
    const user = await authenticate(req, res, next);
    throttle.record(address, email, user !== false);
    if (!user) throw wrongPassword();
    await logIn(req, user);
    res.json(await auth.me(user));
  });

  // The same 202 whether or not the address has an account (see SignupAnswer).
  router.post('/signup', signupsPerAddress, async (req, res) => {
    const user = await auth.signup(parseBody(signupRequest, req));
    if (user) await logIn(req, user);
    res.status(202).json({ message: signupAnswerMessage } satisfies SignupAnswer);
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

  router.use(retryAfterHeader);
  return router;
}
