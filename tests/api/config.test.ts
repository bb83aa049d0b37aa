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

  it('when TRUST_PROXY says off, a hop count or a list of proxies, then it is read as Express takes it, and anything else stops the start naming it', () => {
    for (const off of ['', 'false', 'FALSE', '0', 'no', 'off']) expect([off, loadConfig({ TRUST_PROXY: off }).TRUST_PROXY]).toEqual([off, false]);
    expect(loadConfig({}).TRUST_PROXY).toBe(false);
    expect(loadConfig({ TRUST_PROXY: 'true' }).TRUST_PROXY).toBe(1);
    expect(loadConfig({ TRUST_PROXY: '2' }).TRUST_PROXY).toBe(2);
    expect(loadConfig({ TRUST_PROXY: 'loopback, 10.0.0.0/8, fd00::/8, 192.0.2.7' }).TRUST_PROXY).toEqual(['loopback', '10.0.0.0/8', 'fd00::/8', '192.0.2.7']);
    for (const wrong of ['maybe', '10.0.0.0/33', 'proxy.example.test', '1.2.3']) expect(() => loadConfig({ TRUST_PROXY: wrong })).toThrow(/TRUST_PROXY: /);
  });

  it('when production runs with the development secret, then it refuses to start', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
    expect(loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'a-real-secret-of-enough-length' }).NODE_ENV).toBe('production');
  });
});
