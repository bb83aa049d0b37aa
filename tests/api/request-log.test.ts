import { Writable } from 'node:stream';
import pino from 'pino';
import { isQuiet } from '../../server/http/request-log';
import { makeStudio, makeTestApp, signIn } from '../helpers/test-app';

describe('the request log', () => {
  it('when members poll the stamp and a probe asks for health, then nothing reaches the info log, and a real request is one short line', async () => {
    const lines: { level: number; msg: string; req?: object; res?: object }[] = [];
    const sink = new Writable({
      write(chunk, _encoding, done) {
        lines.push(JSON.parse(String(chunk)));
        done();
      },
    });
    const t = makeTestApp({ log: pino({ level: 'info' }, sink) });
    try {
      const { studioId, members } = await makeStudio(t.db);
      const crew = await signIn(t.app, members.crew.email);
      lines.length = 0;
      for (let poll = 0; poll < 5; poll++) {
        await crew.get(`/api/studios/${studioId}/events/stamp`);
        await crew.get('/api/health');
      }
      await crew.get(`/api/studios/${studioId}/summary`);
      await new Promise((resolve) => setImmediate(resolve));
      expect(lines.map((line) => line.msg)).toEqual([expect.stringMatching(new RegExp(`^GET /api/studios/${studioId}/summary 200 \\d+ ms$`))]);
      expect(lines[0].req).toEqual({ id: expect.anything(), method: 'GET', url: `/api/studios/${studioId}/summary` });
      expect(JSON.stringify(lines[0]).length).toBeLessThan(300);
    } finally {
      await t.close();
    }
  });

  it('when a request is polling or a static file, then it is quiet; writes, feeds and other reads are not', () => {
    expect(isQuiet('GET', '/api/health')).toBe(true);
    expect(isQuiet('GET', '/api/studios/12/events/stamp')).toBe(true);
    expect(isQuiet('GET', '/main-4KQ2.js')).toBe(true);
    expect(isQuiet('GET', '/studios/12/calendar')).toBe(true);
    expect(isQuiet('GET', '/api/studios/12/events?from=2027-03-01&to=2027-03-31')).toBe(false);
    expect(isQuiet('GET', '/api/studios/12/events/stamps')).toBe(false);
    expect(isQuiet('GET', '/feeds/abc.ics')).toBe(false);
    expect(isQuiet('POST', '/api/health')).toBe(false);
  });
});
