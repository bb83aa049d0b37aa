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

  async addInvitation(
    trx: Knex.Transaction,
    invitation: { studioId: number; email: string; role: Role; tokenHash: string; invitedBy: number; expiresAt: Date },
  ): Promise<number> {
    // A newer invitation to the same address replaces any pending one.
    await trx('invitations').where({ studio_id: invitation.studioId, email: invitation.email }).whereNull('accepted_at').delete();
    const [id] = await trx('invitations').insert({
      studio_id: invitation.studioId,
      email: invitation.email,
      role: invitation.role,
      token_hash: invitation.tokenHash,
      invited_by: invitation.invitedBy,
      expires_at: invitation.expiresAt,
    });
    return id;
  }

  async deleteInvitation(studioId: number, invitationId: number): Promise<number> {
    return this.db('invitations').where({ studio_id: studioId, id: invitationId }).whereNull('accepted_at').delete();
  }

  async pendingInvitations(studioId: number, now: Date): Promise<InvitationView[]> {
    const rows = await this.db('invitations as i')
      .leftJoin('users as u', 'u.id', 'i.invited_by')
      .where('i.studio_id', studioId)
      .whereNull('i.accepted_at')
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
