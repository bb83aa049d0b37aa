import type { Knex } from 'knex';
import type { Role, StudioMembershipView } from '@shared/contracts/auth';

export interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
}

export class UserRepository {
  constructor(private readonly db: Knex) {}

  findByEmail(email: string): Promise<UserRow | undefined> {
    return this.db<UserRow>('users').where({ email }).first();
  }

  findById(id: number): Promise<UserRow | undefined> {
    return this.db<UserRow>('users').where({ id }).first();
  }

  async create(trx: Knex.Transaction, user: { email: string; name: string; passwordHash: string }): Promise<number> {
    const [id] = await trx('users').insert({ email: user.email, name: user.name, password_hash: user.passwordHash });
    return id;
  }

  async setPassword(userId: number, passwordHash: string, trx: Knex = this.db): Promise<void> {
    await trx('users').where({ id: userId }).update({ password_hash: passwordHash });
  }

  /** What a password must not be made of: the user's address, name and studio names. */
  async personalWords(userId: number): Promise<string[]> {
    const user = await this.findById(userId);
    if (!user) return [];
    return [user.email, user.name, ...(await this.studiosOf(userId)).map((studio) => studio.name)];
  }

  async studiosOf(userId: number): Promise<Omit<StudioMembershipView, 'today'>[]> {
    const rows = await this.db('memberships as m')
      .join('studios as s', 's.id', 'm.studio_id')
      .where('m.user_id', userId)
      .orderBy('s.name')
      .select<{ id: number; name: string; role: Role; timezone: string }[]>('s.id', 's.name', 'm.role', 's.timezone');
    return rows.map((row) => ({ id: row.id, name: row.name, role: row.role, timezone: row.timezone }));
  }
}
