import { AgendaScheduler } from '../../server/agenda/agenda-scheduler';
import { Mailer } from '../../server/mail/mailer';
import { createLogger } from '../../server/logger';
import { makeStudio, signIn, testConfig } from '../helpers/test-app';
import { fixedClock, useClock } from '../../server/clock/clock';
import { mailCount, makeMailTestApp, waitForMail, type MailTestApp } from '../helpers/mail';
import { addMarket, addStep } from './feeds-fixtures';

let t: MailTestApp;
let mailer: Mailer;
const log = createLogger(testConfig({ LOG_LEVEL: 'silent' }));
beforeAll(async () => {
  t = await makeMailTestApp();
  mailer = new Mailer(t.config);
});
afterAll(async () => {
  mailer.close();
  await t.close();
});

const scheduler = () => new AgendaScheduler(t.db, mailer, 'http://app.example.test', log);
// 2027-03-01 is a Monday; Chicago is on CST (UTC−6) then, so 07:00 there is 13:00 UTC.
const mondaySevenChicago = new Date('2027-03-01T13:00:00Z');

async function chicagoStudio() {
  const studio = await makeStudio(t.db, ['owner', 'partner', 'crew'], 'Prairie Bench');
  await t.db('studios').where({ id: studio.studioId }).update({ timezone: 'America/Chicago' });
  const { owner, crew } = studio.members;
  await addStep(t.db, studio.studioId, { title: 'Batch cut coasters', start: '2027-03-02', end: '2027-03-03', assignee: crew.id, cautions: ['Never leave the laser cutter running unattended.'] });
  await addStep(t.db, studio.studioId, { title: 'Film the jig video', kind: 'content', start: '2027-03-04', assignee: owner.id });
  await addStep(t.db, studio.studioId, { title: 'Next week, not now', start: '2027-03-09', assignee: crew.id });
  await addStep(t.db, studio.studioId, { title: 'Sand the February batch', start: '2027-02-24', end: '2027-02-25', assignee: crew.id });
  const ticked = await addStep(t.db, studio.studioId, { title: 'Ticked last week', start: '2027-02-26', assignee: crew.id });
  await t.db('events').where({ id: ticked }).update({ done: true });
  await addMarket(t.db, studio.studioId, { name: 'Depot Street market', start: '2027-03-06', rrule: 'FREQ=WEEKLY;COUNT=4', deadline: '2027-03-03' });
  return studio;
}

describe('weekly agenda', () => {
  it('when Monday 07:00 arrives in the studio, then each opted-in member gets one mail with their steps, markets and deadlines', async () => {
    const studio = await chicagoStudio();
    const { owner, partner, crew } = studio.members;
    await t.db('users').where({ id: partner.id }).update({ weekly_agenda: false });
    expect(await scheduler().tick(mondaySevenChicago, [studio.studioId])).toBe(2);
    const mail = await waitForMail(t.db, crew.email, /Your week at Prairie Bench/);
    expect(mail.subject).toBe('Your week at Prairie Bench: Mon 1 Mar – Sun 7 Mar');
    expect(mail.to).toBe(crew.email);
    expect(mail.text).toContain('Tue 2 Mar – Wed 3 Mar · Batch cut coasters');
    expect(mail.text).toContain(`http://app.example.test/studios/${studio.studioId}/calendar?date=2027-03-02&event=`);
    // Their step that ended last week undone is still open; the one they ticked is not listed.
    expect(mail.text).toMatch(/Still open from before\n {2}- Wed 24 Feb – Thu 25 Feb · Sand the February batch <[^>]+calendar\?date=2027-02-24&event=\d+>\n\nYour steps/);
    expect(mail.text).not.toContain('Ticked last week');
    expect(mail.text).toContain('Never leave the laser cutter running unattended.');
    expect(mail.text).not.toContain('Film the jig video');
    expect(mail.text).not.toContain('Next week, not now');
    expect(mail.text).toContain('Sat 6 Mar · Depot Street market, Old grain hall');
    expect(mail.text).toContain('Wed 3 Mar · Application deadline: Depot Street market');
    expect(mail.html).toContain(`href="http://app.example.test/studios/${studio.studioId}/calendar?date=2027-03-06"`);
    expect(mail.html).not.toMatch(/<img|src=/);
    const ownersMail = (await waitForMail(t.db, owner.email)).text;
    expect(ownersMail).toContain('Film the jig video');
    // Nothing of the owner's is overdue: no such list in their mail.
    expect(ownersMail).not.toContain('Still open from before');
    expect(await mailCount(t.db, partner.email)).toBe(0);
    expect(await t.db('agenda_sends').where({ studio_id: studio.studioId }).pluck('user_id')).toEqual(expect.arrayContaining([owner.id, crew.id]));
  });

  it('when the server restarts and ticks again that Monday, then nobody gets a second mail; next Monday they do', async () => {
    const studio = await chicagoStudio();
    const { crew } = studio.members;
    expect(await scheduler().tick(mondaySevenChicago, [studio.studioId])).toBe(3);
    const restarted = scheduler();
    expect(await restarted.tick(new Date('2027-03-01T13:01:00Z'), [studio.studioId])).toBe(0);
    expect(await restarted.tick(new Date('2027-03-01T22:00:00Z'), [studio.studioId])).toBe(0);
    await waitForMail(t.db, crew.email);
    expect(await mailCount(t.db, crew.email)).toBe(1);
    expect(await scheduler().tick(new Date('2027-03-08T13:00:00Z'), [studio.studioId])).toBe(3);
    await waitForMail(t.db, crew.email, /8 Mar/);
    expect(await mailCount(t.db, crew.email)).toBe(2);
  });

  it('when two schedulers tick at the same moment, then each member still gets one mail', async () => {
    const studio = await chicagoStudio();
    const results = await Promise.all([scheduler().tick(mondaySevenChicago, [studio.studioId]), scheduler().tick(mondaySevenChicago, [studio.studioId])]);
    expect(results[0] + results[1]).toBe(3);
  });

  it('when it is before 07:00 Monday or another day there, then nothing is sent', async () => {
    const studio = await chicagoStudio();
    expect(await scheduler().tick(new Date('2027-03-01T12:59:00Z'), [studio.studioId])).toBe(0);
    expect(await scheduler().tick(new Date('2027-02-28T13:00:00Z'), [studio.studioId])).toBe(0);
    expect(await scheduler().tick(new Date('2027-03-02T13:00:00Z'), [studio.studioId])).toBe(0);
  });

  it('when the mail cannot be sent, then the claim is given back and a later tick sends it', async () => {
    const studio = await chicagoStudio();
    const broken = new Mailer({ ...t.config, SMTP_PORT: 1 });
    expect(await new AgendaScheduler(t.db, broken, 'http://app.example.test', log).tick(mondaySevenChicago, [studio.studioId])).toBe(0);
    broken.close();
    expect(await t.db('agenda_sends').where({ studio_id: studio.studioId })).toEqual([]);
    expect(await scheduler().tick(new Date('2027-03-01T14:00:00Z'), [studio.studioId])).toBe(3);
  });

  // Local Monday 07:00 through luxon's IANA zone data; the offsets are from memory: US clocks go
  // forward on the second Sunday of March (2027-03-14), New Zealand is UTC+13 in its summer.
  it.each([
    ['America/New_York', '2027-03-15T10:59:00Z', null],
    ['America/New_York', '2027-03-15T11:00:00Z', '2027-03-15'],
    ['America/New_York', '2027-03-08T12:00:00Z', '2027-03-08'],
    ['Pacific/Auckland', '2027-02-28T18:00:00Z', '2027-03-01'],
    ['Pacific/Auckland', '2027-02-28T17:59:00Z', null],
    ['Europe/London', '2027-03-01T07:00:00Z', '2027-03-01'],
  ])('when it is %s at %s, then the due week is %s', (zone, instant, week) => {
    expect(AgendaScheduler.dueWeek(new Date(instant), zone)).toBe(week);
  });
});

describe("this week's agenda on request", () => {
  it('when a member asks on a Thursday, then this week\'s agenda (from Monday) goes to them alone at once, and Monday\'s still goes', async () => {
    // 2027-03-04 is a Thursday (2027-03-01 a Monday, as above); 15:00 in Chicago is 21:00 UTC.
    const restore = useClock(fixedClock('2027-03-04T21:00:00Z'));
    try {
      const studio = await chicagoStudio();
      const { crew, owner } = studio.members;
      const agent = await signIn(t.app, crew.email);
      const response = await agent.post(`/api/studios/${studio.studioId}/agenda/preview`);
      expect(response.status).toBe(202);
      expect(response.body).toEqual({ to: crew.email, week: '2027-03-01' });
      const mail = await waitForMail(t.db, crew.email, /Preview/);
      expect(mail.subject).toBe('Preview · Your week at Prairie Bench: Mon 1 Mar – Sun 7 Mar');
      expect(mail.text).toContain('Tue 2 Mar – Wed 3 Mar · Batch cut coasters');
      expect(await mailCount(t.db, owner.email)).toBe(0);
      expect(await scheduler().tick(mondaySevenChicago, [studio.studioId])).toBe(3);
    } finally {
      restore();
    }
  });

  it('when a member asks more than 5 times in an hour, then 429 says so', async () => {
    const studio = await chicagoStudio();
    const agent = await signIn(t.app, studio.members.partner.email);
    for (let ask = 0; ask < 5; ask++) expect((await agent.post(`/api/studios/${studio.studioId}/agenda/preview`)).status).toBe(202);
    const refused = await agent.post(`/api/studios/${studio.studioId}/agenda/preview`);
    expect([refused.status, refused.body.error.message]).toEqual([429, 'You asked for the agenda 5 times this hour; try again later']);
  });
});
