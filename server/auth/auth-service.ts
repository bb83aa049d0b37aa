import { appClock } from '../clock/clock';
import type { Knex } from 'knex';
import type { MeResponse, SignupRequest } from '@shared/contracts/auth';
import { AppError } from '../http/app-error';
import type { SessionUser } from '../http/auth-middleware';
import { decoyHash, hashPassword, verifyPassword } from './passwords';
import { UserRepository } from './user-repository';

export class AuthService {
  readonly users: UserRepository;

  constructor(private readonly db: Knex) {
    this.users = new UserRepository(db);
  }

  async verify(email: string, password: string): Promise<SessionUser | null> {
    const user = await this.users.findByEmail(email.trim().toLowerCase());
    const isValid = await verifyPassword(user?.password_hash ?? (await decoyHash()), password);
    return user && isValid ? { id: user.id, email: user.email, name: user.name } : null;
  }

  async signup(request: SignupRequest): Promise<SessionUser> {
    if (await this.users.findByEmail(request.email)) {
      throw new AppError('email_taken', 409, 'An account with this e-mail already exists; sign in instead', [
        { path: ['email'], message: 'An account with this e-mail already exists' },
      ]);
    }
    const passwordHash = await hashPassword(request.password);
    return this.db.transaction(async (trx) => {
      const userId = await this.users.create(trx, { email: request.email, name: request.name, passwordHash });
      const [studioId] = await trx('studios').insert({ name: request.studioName });
      await trx('memberships').insert({ studio_id: studioId, user_id: userId, role: 'owner' });
      return { id: userId, email: request.email, name: request.name };
    });
  }

  async me(user: SessionUser): Promise<MeResponse> {
    // Each studio's today comes from the server's clock (the client never trusts the browser's date).
    const studios = (await this.users.studiosOf(user.id)).map((studio) => ({ ...studio, today: appClock.today(studio.timezone) }));
    return { user: { id: user.id, email: user.email, name: user.name }, studios };
  }
}
