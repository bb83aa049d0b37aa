import fs from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { chromium, type Browser, type BrowserContextOptions, type Page } from 'playwright-core';
import { demoStudioSettings, seedDemoStudio } from '../../db/seeds/demo-studio';
import { appClock } from '../../server/clock/clock';
import { makeTestApp, testConfig, type TestApp } from './test-app';

export const chromiumArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

export const screenshotDir = path.resolve(__dirname, '../../test-output/screenshots');

/** The demo studio's today by the app's clock (pinned by KERFCAST_TODAY when set), as the app shows it. */
export function todayIso(): string {
  return appClock.today(demoStudioSettings.timezone);
}

export interface BrowserHarness {
  browser: Browser;
  baseUrl: string;
  app: TestApp;
  demoStudioId: number;
  /** A page in a new browser context (its own cookies and, in Chromium, its own renderer process). */
  newPage(options?: BrowserContextOptions): Promise<Page>;
  close(): Promise<void>;
}

/** The real server with the built client on a free port, the demo studio seeded, and Debian's Chromium. */
export async function startBrowserHarness(): Promise<BrowserHarness> {
  const dist = path.resolve(process.env['E2E_CLIENT_DIST'] ?? path.join(__dirname, '../../dist/kerfcast/browser'));
  if (!fs.existsSync(path.join(dist, 'index.html'))) throw new Error('build the client first: node scripts/build-client.mjs');
  const app = makeTestApp({ config: testConfig({ DB_NAME: process.env['E2E_DB_NAME'] ?? 'kerfcast_e2e', CLIENT_DIST: dist }) });
  const { studioId } = await seedDemoStudio(app.db);
  const server: Server = await new Promise((resolve) => {
    const listening = app.app.listen(0, '127.0.0.1', () => resolve(listening));
  });
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: chromiumArgs });
  fs.mkdirSync(screenshotDir, { recursive: true });
  return {
    browser,
    baseUrl,
    app,
    demoStudioId: studioId,
    async newPage(options = {}) {
      const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 800 }, ...options });
      return context.newPage();
    },
    async close() {
      await browser.close();
      server.closeAllConnections();
      await new Promise((resolve) => server.close(resolve));
      await app.close();
    },
  };
}

export async function signInAs(page: Page, email: string, password = 'kerfcast-demo'): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/studios\/\d+/);
}
