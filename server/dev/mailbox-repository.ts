import type { Knex } from 'knex';
import type { CapturedMail } from '@shared/contracts/team';

interface MailRow {
  id: number;
  to: string;
  subject: string;
  text: string | null;
  html: string | null;
  date: Date;
}

export class MailboxRepository {
  constructor(private readonly db: Knex) {}

  async add(mail: Omit<MailRow, 'id'>): Promise<void> {
    await this.db('dev_mailbox').insert({ ...mail, to: mail.to.slice(0, 1000), subject: mail.subject.slice(0, 500) });
  }

  async isOwnerSomewhere(userId: number): Promise<boolean> {
    return Boolean(await this.db('memberships').where({ user_id: userId, role: 'owner' }).first('studio_id'));
  }

  /** Newest first; `to` narrows to messages addressed to that e-mail. */
  async list(limit: number, to?: string): Promise<CapturedMail[]> {
    const query = this.db<MailRow>('dev_mailbox').orderBy('id', 'desc').limit(limit);
    if (to) query.where('to', 'like', `%${to.replace(/[%_\\]/g, '\\$&')}%`);
    const rows = await query;
    return rows.map((row) => ({ id: row.id, to: row.to, subject: row.subject, text: row.text ?? '', html: row.html ?? '', date: new Date(row.date).toISOString() }));
  }
}
