import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { HASHED_FILE } from '../../server/app';
import { makeTestApp, testConfig } from '../helpers/test-app';

// The built app must request nothing from any other host: fonts and icons ship in the build.
const dist = path.resolve(__dirname, '../../dist/kerfcast/browser');
const files = fs.existsSync(dist) ? fs.readdirSync(dist) : [];

describe('the production build', () => {
  it('when built, then index.html and the CSS exist', () => {
    expect(files).toContain('index.html');
    expect(files.some((file) => file.endsWith('.css'))).toBe(true);
  });

  it('when index.html and the CSS are read, then every URL in them is relative (no remote host)', () => {
    const texts = files.filter((file) => file === 'index.html' || file.endsWith('.css')).map((file) => fs.readFileSync(path.join(dist, file), 'utf8'));
    const remote = texts.flatMap((text) => text.match(/(?:https?:)?\/\/[a-z0-9.-]+\.[a-z]{2,}[^\s"')]*/gi) ?? []);
    // The only absolute URL allowed is the SVG namespace inside inline icons.
    expect(remote.filter((url) => !url.startsWith('http://www.w3.org/'))).toEqual([]);
  });

  it('when the CSS is read, then Roboto and Material Symbols are bundled font files', () => {
    const css = files.filter((file) => file.endsWith('.css')).map((file) => fs.readFileSync(path.join(dist, file), 'utf8')).join('\n');
    expect(css).toMatch(/font-family:\s*Roboto/);
    expect(css).toMatch(/font-family:\s*["']?Material Symbols Outlined/);
    const fontFiles = fs.readdirSync(path.join(dist, 'media')).filter((file) => /\.(woff2?|ttf)$/.test(file));
    expect(fontFiles.some((file) => /roboto/i.test(file))).toBe(true);
    expect(fontFiles.some((file) => /material-symbols/i.test(file))).toBe(true);
  });

  it('when index.html preloads fonts, then each is a built file that the CSS asks for by the same address', () => {
    const html = fs.readFileSync(path.join(dist, 'index.html'), 'utf8');
    const css = files.filter((file) => file.endsWith('.css')).map((file) => fs.readFileSync(path.join(dist, file), 'utf8')).join('\n');
    const preloads = [...html.matchAll(/<link rel="preload" href="([^"]+)" as="font" type="font\/woff2" crossorigin/g)].map((match) => match[1]);
    expect(preloads.length).toBeGreaterThanOrEqual(4);
    // The stylesheet sits beside index.html, whose base is the root: "./media/…" there is "media/…" here.
    const asked = new Set([...css.matchAll(/url\("\.\/([^"]+)"\)/g)].map((match) => match[1]));
    expect(preloads.map((href) => [href, fs.existsSync(path.join(dist, href)), asked.has(href)])).toEqual(preloads.map((href) => [href, true, true]));
  });
});

describe('serving the build', () => {
  it('when a browser asks for a hashed script, then it comes compressed and may be kept a year; index.html is asked again each time', async () => {
    const t = makeTestApp({ config: testConfig({ CLIENT_DIST: dist }) });
    try {
      const script = files.find((file) => /^main-[A-Z0-9]{8}\.js$/.test(file))!;
      expect(HASHED_FILE.test(script)).toBe(true);
      const brotli = await request(t.app).get(`/${script}`).set('Accept-Encoding', 'br, gzip');
      expect([brotli.status, brotli.headers['content-encoding'], brotli.headers['cache-control']]).toEqual([200, 'br', 'public, max-age=31536000, immutable']);
      const gzip = await request(t.app).get(`/${script}`).set('Accept-Encoding', 'gzip');
      expect(gzip.headers['content-encoding']).toBe('gzip');
      const page = await request(t.app).get('/sign-in').set('Accept-Encoding', 'gzip');
      expect([page.status, page.headers['cache-control']]).toEqual([200, 'no-cache']);
      expect(HASHED_FILE.test('roboto-latin-400-normal.woff2')).toBe(false);
    } finally {
      await t.close();
    }
  });
});
