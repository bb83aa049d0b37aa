import type { Knex } from 'knex';
import type { CapturedMail } from '@shared/contracts/team';

interface MailRow {
  id: number;
  to: string;
  subject: string;
  text: string | null;
  html: string | null;
  date: Date;
  kind: string | null;
  studio_id: number | null;
}

export class MailboxRepository {
  constructor(private readonly db: Knex) {}

  async add(mail: Omit<MailRow, 'id'>): Promise<void> {
    await this.db('dev_mailbox').insert({ ...mail, to: mail.to.slice(0, 1000), subject: mail.subject.slice(0, 500) });
  }

  async ownedStudios(userId: number): Promise<number[]> {
    return (await this.db('memberships').where({ user_id: userId, role: 'owner' }).select('studio_id')).map((row) => row.studio_id as number);
  }

  /**
   * What `reader` may read, newest first: mail addressed to their own e-mail, and the invitations the
   * studios they own sent. `to` narrows to one recipient within that.
   */
  async list(reader: { email: string; ownedStudios: number[] }, limit: number, to?: string): Promise<CapturedMail[]> {
    const query = this.db<MailRow>('dev_mailbox')
      .where((readable) => {
        readable.where('to', reader.email);
        if (reader.ownedStudios.length) readable.orWhere((invitations) => invitations.where('kind', 'invitation').whereIn('studio_id', reader.ownedStudios));
      })
      .orderBy('id', 'desc')
      .limit(limit);
    if (to) query.andWhere('to', to);
    const rows = await query;
    return rows.map((row) => ({ id: row.id, to: row.to, subject: row.subject, text: row.text ?? '', html: row.html ?? '', date: new Date(row.date).toISOString() }));
  }
}
