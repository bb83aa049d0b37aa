import type { Knex } from 'knex';
import type { ProfilePatch, ProfileView } from '@shared/contracts/team';

export class AccountRepository {
  constructor(private readonly db: Knex) {}

  async addReset(userId: number, tokenHash: string, expiresAt: Date): Promise<void> {
    await this.db('password_resets').insert({ user_id: userId, token_hash: tokenHash, expires_at: expiresAt });
  }

  findReset(trx: Knex, tokenHash: string): Promise<{ id: number; user_id: number; expires_at: Date; used_at: Date | null } | undefined> {
    return trx('password_resets').where({ token_hash: tokenHash }).forUpdate().first('id', 'user_id', 'expires_at', 'used_at');
  }

  /** Uses this token and every other open one of the user, so an older mail stops working too. */
  async useResets(trx: Knex.Transaction, userId: number, now: Date): Promise<void> {
    await trx('password_resets').where({ user_id: userId }).whereNull('used_at').update({ used_at: now });
  }

  /** Ends the user's sessions (connect-session-knex keeps passport's user id in the JSON), except `keepSid`. */
  async endSessions(trx: Knex, userId: number, keepSid?: string): Promise<number> {
    const query = trx('sessions').whereRaw("JSON_VALUE(sess, '$.passport.user') = ?", [String(userId)]);
    if (keepSid) query.whereNot({ sid: keepSid });
    return query.delete();
  }

  async profile(userId: number): Promise<ProfileView | undefined> {
    const row = await this.db('users').where({ id: userId }).first('id', 'name', 'email', 'weekly_agenda');
    return row && { id: row.id, name: row.name, email: row.email, weeklyAgenda: Boolean(row.weekly_agenda) };
  }

  async updateProfile(userId: number, patch: ProfilePatch): Promise<void> {
    const changes: Record<string, unknown> = {};
    if (patch.name !== undefined) changes['name'] = patch.name;
    if (patch.weeklyAgenda !== undefined) changes['weekly_agenda'] = patch.weeklyAgenda;
    if (Object.keys(changes).length) await this.db('users').where({ id: userId }).update(changes);
  }
}
