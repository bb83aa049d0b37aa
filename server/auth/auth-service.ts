import { appClock } from '../clock/clock';
import type { Knex } from 'knex';
import type { MeResponse, SignupRequest } from '@shared/contracts/auth';
import type { SessionUser } from '../http/auth-middleware';
import { decoyHash, hashPassword, verifyPassword } from './passwords';
import { requireStrongPassword } from './password-strength';
import { SignupNotices, type SignupNoticeDeps } from './signup-notice';
import { UserRepository } from './user-repository';
import { checkStudioPlace } from '../studios/studio-service';

export class AuthService {
  readonly users: UserRepository;
  private readonly notices: SignupNotices | null;

  /** Without `notices` (a mailer), a sign-up for a known address is still answered as a new one, but nobody is told. */
  constructor(
    private readonly db: Knex,
    notices?: SignupNoticeDeps,
  ) {
    this.users = new UserRepository(db);
    this.notices = notices ? new SignupNotices(notices) : null;
  }

  async verify(email: string, password: string): Promise<SessionUser | null> {
    const user = await this.users.findByEmail(email.trim().toLowerCase());
    const isValid = await verifyPassword(user?.password_hash ?? (await decoyHash()), password);
    return user && isValid ? { id: user.id, email: user.email, name: user.name } : null;
  }

  /**
   * A new address gets a user and a studio they own; a known address gets nothing made, and its
   * owner a mail (null comes back). Both cost one password hash, so the caller can answer alike.
   */
  async signup(request: SignupRequest): Promise<SessionUser | null> {
    await requireStrongPassword(request.password, [request.email, request.name, request.studioName]);
    // A new studio's place: its time zone and holidays, checked as the settings check them (US by default).
    checkStudioPlace(request, { country: 'US', region: null });
    const passwordHash = await hashPassword(request.password);
    if (await this.users.findByEmail(request.email)) return this.knownAddress(request.email);
    try {
      return await this.db.transaction(async (trx) => {
        const userId = await this.users.create(trx, { email: request.email, name: request.name, passwordHash });
        const place = { timezone: request.timezone, country: request.country, region: request.region ?? null };
        const [studioId] = await trx('studios').insert({ name: request.studioName, ...Object.fromEntries(Object.entries(place).filter(([, value]) => value !== undefined && value !== null)) });
        await trx('memberships').insert({ studio_id: studioId, user_id: userId, role: 'owner' });
        return { id: userId, email: request.email, name: request.name };
      });
    } catch (error) {
      // Two sign-ups for one new address at once: the second finds it taken, as if it had been before.
      if ((error as { code?: unknown }).code === 'ER_DUP_ENTRY') return this.knownAddress(request.email);
      throw error;
    }
  }

  async me(user: SessionUser): Promise<MeResponse> {
    // Each studio's today comes from the server's clock (the client never trusts the browser's date).
    const studios = (await this.users.studiosOf(user.id)).map((studio) => ({ ...studio, today: appClock.today(studio.timezone) }));
    return { user: { id: user.id, email: user.email, name: user.name }, studios };
  }

  private knownAddress(email: string): null {
    this.notices?.tell(email);
    return null;
  }
}
