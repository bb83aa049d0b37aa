import type { Logger } from 'pino';
import { renderMail } from '../mail/mail-layout';
import type { Mailer } from '../mail/mailer';

export interface SignupNoticeDeps {
  mailer: Mailer;
  publicUrl: string;
  log: Pick<Logger, 'error'>;
}

const quietMs = 3600_000;
const maxRemembered = 10_000;

/**
 * Tells the owner of an address that someone tried to sign up with it. The mail carries nothing the
 * person signing up typed (no name, no studio name), so it cannot carry someone else's message, and
 * it goes at most once an hour per address, so repeated sign-ups cannot flood an inbox.
 */
export class SignupNotices {
  /** When each address was last told; real time, as for every throttle. */
  private readonly sentAt = new Map<string, number>();

  constructor(private readonly deps: SignupNoticeDeps) {}

  /** Sends after the answer has gone, so the sign-up's reply and timing are those of a new address. */
  tell(email: string): void {
    const now = Date.now();
    const last = this.sentAt.get(email);
    if (last !== undefined && now - last < quietMs) return;
    if (this.sentAt.size >= maxRemembered) this.forgetOld(now);
    this.sentAt.set(email, now);
    void this.deps.mailer
      .send({ to: email, subject: 'Someone tried to sign up to Kerfcast with your address', ...this.mail(email), tag: { kind: 'account' } })
      .catch((error: Error) => this.deps.log.error({ err: error }, 'sign-up notice mail failed'));
  }

  private mail(email: string) {
    const { publicUrl } = this.deps;
    return renderMail('Someone tried to sign up with your address', [
      { kind: 'paragraph', text: `Someone (perhaps you) tried to start a new Kerfcast studio with ${email}, which already has an account. Nothing was changed.` },
      { kind: 'paragraph', text: 'If it was you, sign in with your password:' },
      { kind: 'button', label: 'Sign in', url: `${publicUrl}/sign-in` },
      { kind: 'paragraph', text: 'If you do not remember the password, choose a new one:' },
      { kind: 'button', label: 'Reset your password', url: `${publicUrl}/forgot-password` },
      { kind: 'small', text: 'If it was not you, ignore this e-mail: your account and password stay as they are.' },
    ]);
  }

  private forgetOld(now: number): void {
    for (const [address, at] of this.sentAt) if (now - at >= quietMs) this.sentAt.delete(address);
    if (this.sentAt.size >= maxRemembered) this.sentAt.delete(this.sentAt.keys().next().value as string);
  }
}
