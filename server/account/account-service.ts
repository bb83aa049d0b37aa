import { appClock, type Clock } from '../clock/clock';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { ProfilePatch, ProfileView } from '@shared/contracts/team';
import { hashPassword } from '../auth/passwords';
import { requireStrongPassword } from '../auth/password-strength';
import { UserRepository } from '../auth/user-repository';
import { AppError, notFound } from '../http/app-error';
import { renderMail } from '../mail/mail-layout';
import type { Mailer } from '../mail/mailer';
import { AccountRepository } from './account-repository';
import { hashToken, newToken } from './tokens';

export const resetMinutes = 60;

export class AccountService {
  private readonly accounts: AccountRepository;
  private readonly users: UserRepository;

  constructor(
    private readonly db: Knex,
    private readonly mailer: Mailer,
    private readonly publicUrl: string,
    private readonly log: Pick<Logger, 'error'>,
    private readonly clock: Clock = appClock,
  ) {
    this.accounts = new AccountRepository(db);
    this.users = new UserRepository(db);
  }

  /**
   * Starts a reset. The caller answers the same whether or not the address has an account, and the
   * work runs after the answer, so neither the reply nor its timing tells them apart.
   */
  requestReset(email: string): void {
    void this.sendReset(email).catch((error: Error) => this.log.error({ err: error }, 'password reset mail failed'));
  }

  private async sendReset(email: string): Promise<void> {
    const user = await this.users.findByEmail(email);
    if (!user) return;
    const token = newToken();
    await this.accounts.addReset(user.id, hashToken(token), new Date(this.clock.now().getTime() + resetMinutes * 60_000));
    const mail = renderMail('Reset your Kerfcast password', [
      { kind: 'paragraph', text: `Someone (we hope you) asked to reset the password of ${user.email}.` },
      { kind: 'button', label: 'Choose a new password', url: `${this.publicUrl}/reset-password/${token}` },
      { kind: 'small', text: `The link works once, for ${resetMinutes} minutes. If you did not ask, ignore this e-mail: your password stays as it is.` },
    ]);
    await this.mailer.send({ to: user.email, subject: 'Reset your Kerfcast password', ...mail });
  }

  /** Sets the new password, uses up the user's reset links and ends their other sessions. */
  async resetPassword(token: string, password: string, currentSid?: string): Promise<void> {
    const tokenHash = hashToken(token);
    const { user_id: userId } = usableReset(await this.accounts.findReset(this.db, tokenHash), this.clock.now());
    await requireStrongPassword(password, await this.users.personalWords(userId));
    const passwordHash = await hashPassword(password);
    await this.db.transaction(async (trx) => {
      // Checked again inside: the link is single use even when two tabs send it at once.
      const reset = usableReset(await this.accounts.findReset(trx, tokenHash), this.clock.now());
      await this.users.setPassword(reset.user_id, passwordHash, trx);
      await this.accounts.useResets(trx, reset.user_id, this.clock.now());
      await this.accounts.endSessions(trx, reset.user_id, currentSid);
    });
  }

  async profile(userId: number): Promise<ProfileView> {
    const profile = await this.accounts.profile(userId);
    if (!profile) throw notFound('Account');
    return profile;
  }

  async updateProfile(userId: number, patch: ProfilePatch): Promise<ProfileView> {
    await this.accounts.updateProfile(userId, patch);
    return this.profile(userId);
  }
}

function usableReset<T extends { user_id: number; expires_at: Date; used_at: Date | null }>(reset: T | undefined, now: Date): T {
  if (!reset) throw new AppError('not_found', 404, 'This reset link is not valid; ask for a new one');
  if (reset.used_at) throw new AppError('reset_used', 410, 'This reset link has already been used; ask for a new one');
  if (new Date(reset.expires_at) <= now) throw new AppError('reset_expired', 410, 'This reset link has expired; ask for a new one');
  return reset;
}
