import type { Knex } from 'knex';

export interface AgendaStudio {
  id: number;
  name: string;
  timezone: string;
}

export interface AgendaMember {
  userId: number;
  name: string;
  email: string;
}

export class AgendaRepository {
  constructor(private readonly db: Knex) {}

  studios(onlyIds?: number[]): Promise<AgendaStudio[]> {
    const query = this.db('studios').select('id', 'name', 'timezone');
    if (onlyIds) query.whereIn('id', onlyIds);
    return query;
  }

  /** Members who want the agenda and have not had this week's yet. */
  async due(studioId: number, week: string): Promise<AgendaMember[]> {
    const rows = await this.db('memberships as m')
      .join('users as u', 'u.id', 'm.user_id')
      .leftJoin('agenda_sends as a', (join) => join.on('a.studio_id', 'm.studio_id').andOn('a.user_id', 'm.user_id').andOnVal('a.week', week))
      .where({ 'm.studio_id': studioId, 'u.weekly_agenda': true })
      .whereNull('a.user_id')
      .select('u.id', 'u.name', 'u.email');
    return rows.map((row: { id: number; name: string; email: string }) => ({ userId: row.id, name: row.name, email: row.email }));
  }

  /** Claims the (studio, member, week) send; false when another tick or process claimed it first. */
  async claim(studioId: number, userId: number, week: string): Promise<boolean> {
    const [result] = await this.db.raw('INSERT IGNORE INTO agenda_sends (studio_id, user_id, week) VALUES (?, ?, ?)', [studioId, userId, week]);
    return (result as { affectedRows: number }).affectedRows === 1;
  }

  /** Gives a claim back when the mail could not be sent, so a later tick tries again. */
  async release(studioId: number, userId: number, week: string): Promise<void> {
    await this.db('agenda_sends').where({ studio_id: studioId, user_id: userId, week }).delete();
  }
}
