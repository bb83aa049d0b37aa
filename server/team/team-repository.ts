import type { Knex } from 'knex';
import type { Role } from '@shared/contracts/auth';
import type { InvitationView, MemberView } from '@shared/contracts/team';

export interface InvitationRow {
  id: number;
  studio_id: number;
  email: string;
  role: Role;
  token_hash: string;
  invited_by: number | null;
  created_at: Date;
  expires_at: Date;
  accepted_at: Date | null;
}

export class TeamRepository {
  constructor(readonly db: Knex) {}

  async members(studioId: number, viewerId: number): Promise<MemberView[]> {
    const rows = await this.db('memberships as m')
      .join('users as u', 'u.id', 'm.user_id')
      .where('m.studio_id', studioId)
      .orderByRaw("FIELD(m.role, 'owner', 'partner', 'crew')")
      .orderBy('u.name')
      .select<{ id: number; name: string; email: string; role: Role; created_at: Date }[]>('u.id', 'u.name', 'u.email', 'm.role', 'm.created_at');
    return rows.map((row) => ({
      userId: row.id,
      name: row.name,
      email: row.email,
      role: row.role,
      joinedAt: new Date(row.created_at).toISOString(),
      isYou: row.id === viewerId,
    }));
  }

  /** The member's role, locking the studio's membership rows so two owners cannot demote each other at once. */
  async lockRoles(trx: Knex.Transaction, studioId: number): Promise<{ user_id: number; role: Role }[]> {
    return trx('memberships').where({ studio_id: studioId }).forUpdate().select('user_id', 'role');
  }

  async setRole(trx: Knex.Transaction, studioId: number, userId: number, role: Role): Promise<void> {
    await trx('memberships').where({ studio_id: studioId, user_id: userId }).update({ role });
  }

  /** Removes the membership and the member's feeds of this studio in one go, so the feeds stop at once. */
  async remove(trx: Knex.Transaction, studioId: number, userId: number): Promise<void> {
    await trx('feeds').where({ studio_id: studioId, user_id: userId }).delete();
    await trx('memberships').where({ studio_id: studioId, user_id: userId }).delete();
  }

  async isMemberByEmail(studioId: number, email: string): Promise<boolean> {
    const row = await this.db('memberships as m').join('users as u', 'u.id', 'm.user_id').where({ 'm.studio_id': studioId, 'u.email': email }).first('u.id');
    return Boolean(row);
  }

  /** When the studio's invitations since `since` were sent, locking the studio row so two sends at once count each other. */
  async lockInvitationsSentSince(trx: Knex.Transaction, studioId: number, since: Date): Promise<Date[]> {
    await trx('studios').where({ id: studioId }).forUpdate().first('id');
    const rows = await trx('invitations').where({ studio_id: studioId }).where('created_at', '>', since).select<{ created_at: Date }[]>('created_at');
    return rows.map((row) => new Date(row.created_at));
  }

  async addInvitation(
    trx: Knex.Transaction,
    invitation: { studioId: number; email: string; role: Role; tokenHash: string; invitedBy: number; createdAt: Date; expiresAt: Date },
  ): Promise<number> {
    // A newer invitation to the same address replaces any pending one.
    await retire(trx, { studio_id: invitation.studioId, email: invitation.email });
    const [id] = await trx('invitations').insert({
      studio_id: invitation.studioId,
      email: invitation.email,
      role: invitation.role,
      token_hash: invitation.tokenHash,
      invited_by: invitation.invitedBy,
      created_at: invitation.createdAt,
      expires_at: invitation.expiresAt,
    });
    return id;
  }

  async revokeInvitation(studioId: number, invitationId: number): Promise<number> {
    return retire(this.db, { studio_id: studioId, id: invitationId });
  }

  async pendingInvitations(studioId: number, now: Date): Promise<InvitationView[]> {
    const rows = await this.db('invitations as i')
      .leftJoin('users as u', 'u.id', 'i.invited_by')
      .where('i.studio_id', studioId)
      .whereNull('i.accepted_at')
      .whereRaw('i.expires_at > i.created_at')
      .where('i.expires_at', '>', now)
      .orderBy('i.created_at', 'desc')
      .select<(InvitationRow & { inviter: string | null })[]>('i.*', 'u.name as inviter');
    return rows.map((row) => ({
      id: row.id,
      email: row.email,
      role: row.role,
      invitedBy: row.inviter,
      createdAt: new Date(row.created_at).toISOString(),
      expiresAt: new Date(row.expires_at).toISOString(),
    }));
  }

  findInvitationByHash(tokenHash: string, trx: Knex = this.db): Promise<(InvitationRow & { studio_name: string }) | undefined> {
    return trx('invitations as i').join('studios as s', 's.id', 'i.studio_id').where('i.token_hash', tokenHash).first('i.*', 's.name as studio_name');
  }

  /** Marks the invitation used; 0 when someone used it a moment earlier (single use under concurrency). */
  async markAccepted(trx: Knex.Transaction, invitationId: number, userId: number, now: Date): Promise<number> {
    return trx('invitations').where({ id: invitationId }).whereNull('accepted_at').update({ accepted_at: now, accepted_by: userId });
  }

  async membershipOf(trx: Knex, studioId: number, userId: number): Promise<{ role: Role } | undefined> {
    return trx('memberships').where({ studio_id: studioId, user_id: userId }).first('role');
  }

  async addMember(trx: Knex.Transaction, studioId: number, userId: number, role: Role): Promise<void> {
    await trx('memberships').insert({ studio_id: studioId, user_id: userId, role });
  }

  async studioName(studioId: number): Promise<string> {
    return (await this.db('studios').where({ id: studioId }).first('name'))?.name ?? '';
  }
}

/**
 * Ends pending invitations (revoked or replaced) but keeps their rows, which the sending limits
 * count: the token's hash becomes one nobody holds a token for, and it expires as it was made.
 */
function retire(db: Knex, which: { studio_id: number; email?: string; id?: number }): Promise<number> {
  return db('invitations')
    .where(which)
    .whereNull('accepted_at')
    .whereRaw('expires_at > created_at')
    .update({ token_hash: db.raw("SHA2(CONCAT('retired:', id, ':', UUID()), 256)"), expires_at: db.raw('created_at') });
}
