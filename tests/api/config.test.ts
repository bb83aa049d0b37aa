import { loadConfig } from '../../server/config';

describe('configuration', () => {
  it('when nothing is set, then the documented defaults apply', () => {
    const config = loadConfig({});
    expect(config).toMatchObject({ PORT: 3000, DB_PORT: 3307, SMTP_PORT: 2525, UPLOAD_LIMIT_MB: 25 });
    expect(config.publicUrl).toBe('http://127.0.0.1:3000');
  });

  it('when a port is not a number, then the message names the variable', () => {
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(/PORT/);
    expect(() => loadConfig({ DB_PORT: '70000' })).toThrow(/DB_PORT/);
  });

  it('when production runs with the development secret, then it refuses to start', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
    expect(loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'a-real-secret-of-enough-length' }).NODE_ENV).toBe('production');
  });
});
