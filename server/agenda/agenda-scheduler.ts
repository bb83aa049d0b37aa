import { appClock } from '../clock/clock';
import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { Logger } from 'pino';
import { addDays, isoWeekday, type IsoDate } from '@shared/calendar/dates';
import { AT_HAND_OVERDUE_LIMIT, type CalendarEvent } from '@shared/contracts/calendar';
import { EventRepository } from '../events/event-repository';
import { ruleEvents } from '../events/event-service';
import { toCalendarEvent } from '../events/event-views';
import { renderMail, type MailBlock } from '../mail/mail-layout';
import type { Mailer } from '../mail/mailer';
import { loadStudioCalendar } from '../occasions/studio-calendar';
import { AgendaRepository, type AgendaMember, type AgendaStudio } from './agenda-repository';
import { AppError } from '../http/app-error';

/** Monday (ISO weekday 1) at 07:00 on the studio's own clock. */
export const AGENDA_WEEKDAY = 1;
export const AGENDA_HOUR = 7;

const dayLabel = (date: IsoDate) => DateTime.fromISO(date).toFormat('ccc d LLL');
const span = (start: IsoDate, end: IsoDate) => (start === end ? dayLabel(start) : `${dayLabel(start)} – ${dayLabel(end)}`);

/**
 * Sends each member who has not opted out their agenda for the coming 7 days. Runs on a timer in
 * the server process; every send is claimed first in agenda_sends (unique per studio, member and
 * week), so restarts and several processes never send one twice.
 */
export class AgendaScheduler {
  private readonly agenda: AgendaRepository;
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<unknown> = Promise.resolve();

  constructor(
    private readonly db: Knex,
    private readonly mailer: Mailer,
    private readonly publicUrl: string,
    private readonly log: Pick<Logger, 'error' | 'info'>,
  ) {
    this.agenda = new AgendaRepository(db);
  }

  start(everyMs = 60_000): void {
    this.timer = setInterval(() => {
      this.running = this.tick(appClock.now()).catch((error: Error) => this.log.error({ err: error }, 'weekly agenda tick failed'));
    }, everyMs);
    this.timer.unref();
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    await this.running;
  }

  /** The Monday whose agenda is due at `now` in `timezone`, or null before 07:00 Monday or on other days. */
  static dueWeek(now: Date, timezone: string): IsoDate | null {
    const local = DateTime.fromJSDate(now, { zone: timezone });
    if (!local.isValid || local.weekday !== AGENDA_WEEKDAY || local.hour < AGENDA_HOUR) return null;
    return local.toISODate();
  }

  /** One pass at `now`; returns how many mails went out. `onlyStudios` narrows the pass (tests, manual runs). */
  async tick(now: Date, onlyStudios?: number[]): Promise<number> {
    let sent = 0;
    for (const studio of await this.agenda.studios(onlyStudios)) {
      const week = AgendaScheduler.dueWeek(now, studio.timezone);
      if (!week) continue;
      const members = await this.agenda.due(studio.id, week);
      if (members.length === 0) continue;
      const content = await this.weekOf(studio, week);
      for (const member of members) {
        if (!(await this.agenda.claim(studio.id, member.userId, week))) continue;
        try {
          await this.mailer.send(this.mailFor(studio, member, week, content));
          sent += 1;
        } catch (error) {
          await this.agenda.release(studio.id, member.userId, week);
          this.log.error({ err: error, studioId: studio.id, userId: member.userId }, 'weekly agenda mail failed; will retry');
        }
      }
    }
    if (sent) this.log.info(`weekly agenda: sent ${sent}`);
    return sent;
  }

  /**
   * This week's agenda (from the studio's Monday of today) sent now to one member who asks for it,
   * as Monday's would read; nothing is claimed, so Monday's still goes. Returns where it went.
   */
  async sendPreview(studioId: number, member: AgendaMember): Promise<{ to: string; week: IsoDate }> {
    const [studio] = await this.agenda.studios([studioId]);
    if (!studio) throw new Error(`no studio ${studioId}`);
    const today = appClock.today(studio.timezone);
    const week = addDays(today, -((isoWeekday(today) - AGENDA_WEEKDAY + 7) % 7));
    const mail = this.mailFor(studio, member, week, await this.weekOf(studio, week));
    // Only the mail server's failure is a 502; the database's stays its own (503) error.
    await this.mailer.send({ ...mail, subject: `Preview · ${mail.subject}` }).catch(() => {
      throw new AppError('mail_failed', 502, "This week's agenda could not be sent just now; try again in a moment");
    });
    return { to: member.email, week };
  }

  private async weekOf(studio: AgendaStudio, week: IsoDate) {
    const to = addDays(week, 6);
    const events = new EventRepository(this.db);
    const [rows, late, calendar] = await Promise.all([events.inRange(studio.id, week, to), events.overdue(studio.id, week, AT_HAND_OVERDUE_LIMIT), loadStudioCalendar(this.db, studio.id)]);
    const steps = rows.filter((row) => row.start_date).map((row) => toCalendarEvent(row, 'crew'));
    const overdue = late.rows.map((row) => toCalendarEvent(row, 'crew'));
    const rules = ruleEvents(calendar, week, to);
    return { to, steps, overdue, markets: rules.filter((event) => event.kind === 'market'), deadlines: rules.filter((event) => event.kind === 'deadline') };
  }

  private mailFor(studio: AgendaStudio, member: AgendaMember, week: IsoDate, content: Awaited<ReturnType<AgendaScheduler['weekOf']>>) {
    const link = (date: IsoDate) => `${this.publicUrl}/studios/${studio.id}/calendar?date=${date}`;
    const stepItem = (step: CalendarEvent) => ({
      text: `${span(step.start, step.end)} · ${step.title}${step.done ? ' (done)' : ''}`,
      url: `${link(step.start)}&event=${step.id}`,
      note: step.cautions?.length ? `Cautions: ${step.cautions.join(' ')} Your machine manuals, local codes and licensed professionals have the last word.` : undefined,
    });
    const isMine = (step: CalendarEvent) => step.assigneeId === member.userId;
    const stillOpen = content.overdue.filter(isMine);
    const blocks: MailBlock[] = [
      { kind: 'paragraph', text: `Hello ${member.name}, here is what is on at ${studio.name} from ${span(week, content.to)}.` },
      // Only when there is any: steps of yours that ended before this week and are not ticked done.
      ...(stillOpen.length ? [{ kind: 'list' as const, title: 'Still open from before', items: stillOpen.map(stepItem) }] : []),
      { kind: 'list', title: 'Your steps', items: content.steps.filter(isMine).map(stepItem) },
      {
        kind: 'list',
        title: 'Markets',
        items: content.markets.map((market) => ({ text: `${dayLabel(market.start)} · ${market.title}${market.place ? `, ${market.place}` : ''}${market.hours ? ` (${market.hours})` : ''}`, url: link(market.start) })),
      },
      { kind: 'list', title: 'Deadlines', items: content.deadlines.map((deadline) => ({ text: `${dayLabel(deadline.start)} · ${deadline.title}`, url: link(deadline.start) })) },
      { kind: 'button', label: 'Open the calendar', url: link(week) },
      { kind: 'small', text: `You get this every Monday morning. Turn it off in your profile: ${this.publicUrl}/studios/${studio.id}/profile` },
    ];
    return { to: member.email, subject: `Your week at ${studio.name}: ${span(week, content.to)}`, ...renderMail(`Your week at ${studio.name}`, blocks), tag: { kind: 'agenda' as const, studioId: studio.id } };
  }
}
