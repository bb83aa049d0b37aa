// npm run bench:first-load (issue 24): bytes on the wire for the sign-in page and the signed-in home
// page from a cold cache, in Debian's Chromium, counted from the DevTools protocol's
// encodedDataLength of every response; once as the browser asks (compressed) and once with
// Accept-Encoding: identity (as before compression). Targets: sign-in ≤ 150 kB, home ≤ 350 kB.
// Uses the e2e database (kerfcast_bench_first_load) and the built client in dist/.
import type { Page } from 'playwright-core';
import { prepareDatabase } from '../helpers/global-setup';
import { signInAs, startBrowserHarness } from '../helpers/browser';

const DATABASE = 'kerfcast_bench_first_load';

async function wireBytes(page: Page, load: () => Promise<void>): Promise<{ kB: number; responses: number }> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
  let bytes = 0;
  let responses = 0;
  cdp.on('Network.loadingFinished', (event) => {
    bytes += event.encodedDataLength;
    responses += 1;
  });
  await load();
  await page.waitForLoadState('networkidle');
  await cdp.detach();
  return { kB: Math.round(bytes / 102.4) / 10, responses };
}

async function main(): Promise<void> {
  process.env['E2E_DB_NAME'] = DATABASE;
  await prepareDatabase(DATABASE);
  const harness = await startBrowserHarness();
  try {
    for (const encoding of ['as the browser asks', 'identity'] as const) {
      const headers = encoding === 'identity' ? { 'Accept-Encoding': 'identity' } : undefined;
      const page = await harness.newPage(headers ? { extraHTTPHeaders: headers } : {});
      const signInPage = await wireBytes(page, async () => {
        await page.goto('/sign-in');
        await page.getByLabel('E-mail').waitFor();
      });
      const home = await wireBytes(page, async () => {
        await signInAs(page, 'partner@demo.test');
        await page.locator('kc-work-at-hand').waitFor();
      });
      console.log(`${encoding.padEnd(20)} sign-in page ${signInPage.kB} kB in ${signInPage.responses} responses; sign-in and home ${home.kB} kB in ${home.responses}`);
      await page.context().close();
    }
  } finally {
    await harness.close();
  }
}

main().catch((error: Error) => {
  console.error(error);
  process.exit(1);
});
