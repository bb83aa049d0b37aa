import { appClock, type Clock } from '../clock/clock';
import type { Knex } from 'knex';
import type { Role } from '@shared/contracts/auth';
import type {
  InvitationAccepted,
  InvitationPreview,
  InvitationRequest,
  InvitationView,
  MemberPatch,
  MemberView,
} from '@shared/contracts/team';
import { hashToken, newToken } from '../account/tokens';
import { hashPassword } from '../auth/passwords';
import { requireStrongPassword } from '../auth/password-strength';
import { UserRepository } from '../auth/user-repository';
import { AppError, forbidden, notFound } from '../http/app-error';
import type { SessionUser, StudioContext } from '../http/auth-middleware';
import { renderMail } from '../mail/mail-layout';
import type { Mailer } from '../mail/mailer';
import { longestLimitWindowMs, requireInvitationRoom } from './invitation-limits';
import { TeamRepository, type InvitationRow } from './team-repository';

export const invitationDays = 7;
const roleWords: Record<Role, string> = {
  owner: 'an owner (everything, including members and settings)',
  partner: 'a partner (plans and moves work, imports, edits runways and markets)',
  crew: 'crew (reads everything, ticks off their own steps, has their own feed)',
};

const lastOwner = (name: string) =>
  new AppError('last_owner', 409, `${name} is the studio's only owner; make another member owner first`);

export class TeamService {
  private readonly team: TeamRepository;
  private readonly users: UserRepository;

  constructor(
    private readonly db: Knex,
    private readonly mailer: Mailer,
    private readonly publicUrl: string,
    private readonly clock: Clock = appClock,
  ) {
    this.team = new TeamRepository(db);
    this.users = new UserRepository(db);
  }

  members(studio: StudioContext, viewer: SessionUser): Promise<MemberView[]> {
    return this.team.members(studio.id, viewer.id);
  }

  async changeRole(studio: StudioContext, viewer: SessionUser, userId: number, patch: MemberPatch): Promise<MemberView[]> {
    await this.db.transaction(async (trx) => {
      const roles = await this.team.lockRoles(trx, studio.id);
      const target = roles.find((row) => row.user_id === userId);
      if (!target) throw notFound('Member');
      const owners = roles.filter((row) => row.role === 'owner').length;
      if (target.role === 'owner' && patch.role !== 'owner' && owners === 1) throw lastOwner(await this.nameOf(userId));
      await this.team.setRole(trx, studio.id, userId, patch.role);
    });
    return this.members(studio, viewer);
  }

  /** The owner removes anyone; any member may remove themselves (leave). The last owner may do neither. */
  async remove(studio: StudioContext, viewer: SessionUser, userId: number): Promise<void> {
    if (studio.role !== 'owner' && userId !== viewer.id) throw forbidden('Only an owner may remove other members');
    await this.db.transaction(async (trx) => {
      const roles = await this.team.lockRoles(trx, studio.id);
      const target = roles.find((row) => row.user_id === userId);
      if (!target) throw notFound('Member');
      if (target.role === 'owner' && roles.filter((row) => row.role === 'owner').length === 1) throw lastOwner(await this.nameOf(userId));
      await this.team.remove(trx, studio.id, userId);
    });
  }

  async invite(studio: StudioContext, viewer: SessionUser, request: InvitationRequest): Promise<InvitationView> {
    if (await this.team.isMemberByEmail(studio.id, request.email)) {
      throw new AppError('already_member', 409, `${request.email} is already a member of this studio`, [
        { path: ['email'], message: 'Already a member of this studio' },
      ]);
    }
    const token = newToken();
    const now = this.clock.now();
    const expiresAt = new Date(now.getTime() + invitationDays * 24 * 3600 * 1000);
    const studioName = await this.team.studioName(studio.id);
    // Stored and mailed in one transaction: when the mail cannot be sent, no invitation is left behind.
    const id = await this.db.transaction(async (trx) => {
      requireInvitationRoom(await this.team.lockInvitationsSentSince(trx, studio.id, new Date(now.getTime() - longestLimitWindowMs)), now);
      const invitationId = await this.team.addInvitation(trx, {
        studioId: studio.id,
        email: request.email,
        role: request.role,
        tokenHash: hashToken(token),
        invitedBy: viewer.id,
        createdAt: now,
        expiresAt,
      });
      await this.mailer
        .send({ to: request.email, subject: `${viewer.name} invites you to ${studioName} on Kerfcast`, ...this.invitationMail(viewer, studioName, request.role, token, expiresAt), tag: { kind: 'invitation', studioId: studio.id } })
        .catch((error: Error) => {
          throw new AppError('mail_failed', 502, `The invitation e-mail could not be sent (${error.message}); nothing was stored, try again`);
        });
      return invitationId;
    });
    return { id, email: request.email, role: request.role, invitedBy: viewer.name, createdAt: now.toISOString(), expiresAt: expiresAt.toISOString() };
  }

  private invitationMail(inviter: SessionUser, studioName: string, role: Role, token: string, expiresAt: Date) {
    return renderMail(`Join ${studioName} on Kerfcast`, [
      { kind: 'paragraph', text: `${inviter.name} invites you to join ${studioName} as ${roleWords[role]}.` },
      { kind: 'button', label: 'Accept the invitation', url: `${this.publicUrl}/invitations/${token}` },
      { kind: 'small', text: `The link works once and until ${expiresAt.toUTCString()}. If you did not expect it, ignore this e-mail.` },
    ]);
  }

  pending(studio: StudioContext): Promise<InvitationView[]> {
    return this.team.pendingInvitations(studio.id, this.clock.now());
  }

  async revoke(studio: StudioContext, invitationId: number): Promise<void> {
    if ((await this.team.revokeInvitation(studio.id, invitationId)) === 0) throw notFound('Pending invitation');
  }

  async preview(token: string): Promise<InvitationPreview> {
    const invitation = await this.usable(token);
    return {
      studioName: invitation.studio_name,
      role: invitation.role,
      email: invitation.email,
      hasAccount: Boolean(await this.users.findByEmail(invitation.email)),
      expiresAt: new Date(invitation.expires_at).toISOString(),
    };
  }

  async accept(token: string, user: SessionUser): Promise<InvitationAccepted> {
    const invitation = await this.usable(token);
    if (invitation.email !== user.email.toLowerCase()) {
      throw new AppError(
        'invitation_other_address',
        403,
        `This invitation is for ${invitation.email}, but you are signed in as ${user.email}; sign out and sign in (or sign up) with ${invitation.email}`,
      );
    }
    return this.join(invitation, user.id);
  }

  /** An account for the invited address (no studio of its own), joined to the studio at once. */
  async signUpAndAccept(token: string, name: string, password: string): Promise<{ user: SessionUser; accepted: InvitationAccepted }> {
    const invitation = await this.usable(token);
    if (await this.users.findByEmail(invitation.email)) {
      throw new AppError('email_taken', 409, `An account for ${invitation.email} exists already; sign in to accept`);
    }
    await requireStrongPassword(password, [invitation.email, name, invitation.studio_name]);
    const passwordHash = await hashPassword(password);
    return this.db.transaction(async (trx) => {
      const userId = await this.users.create(trx, { email: invitation.email, name, passwordHash });
      const accepted = await this.join(invitation, userId, trx);
      return { user: { id: userId, email: invitation.email, name }, accepted };
    });
  }

  private async join(invitation: InvitationRow & { studio_name: string }, userId: number, outer?: Knex.Transaction): Promise<InvitationAccepted> {
    const work = async (trx: Knex.Transaction) => {
      if (await this.team.membershipOf(trx, invitation.studio_id, userId)) {
        throw new AppError('already_member', 409, `You are already a member of ${invitation.studio_name}`);
      }
      if ((await this.team.markAccepted(trx, invitation.id, userId, this.clock.now())) === 0) throw used();
      await this.team.addMember(trx, invitation.studio_id, userId, invitation.role);
      return { studioId: invitation.studio_id, studioName: invitation.studio_name, role: invitation.role };
    };
    return outer ? work(outer) : this.db.transaction(work);
  }

  private async usable(token: string): Promise<InvitationRow & { studio_name: string }> {
    const invitation = await this.team.findInvitationByHash(hashToken(token));
    if (!invitation) {
      throw new AppError('not_found', 404, 'This invitation link is not valid: it may have been revoked or replaced by a newer one');
    }
    if (invitation.accepted_at) throw used();
    if (new Date(invitation.expires_at) <= this.clock.now()) {
      throw new AppError('invitation_expired', 410, 'This invitation has expired; ask the studio owner to send a new one');
    }
    return invitation;
  }

  private async nameOf(userId: number): Promise<string> {
    return (await this.users.findById(userId))?.name ?? 'This member';
  }
}

const used = () => new AppError('invitation_used', 410, 'This invitation has already been used; ask the studio owner for a new one if you need it');
