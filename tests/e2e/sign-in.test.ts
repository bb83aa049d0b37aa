import path from 'node:path';
import { screenshotDir, signInAs, startBrowserHarness, type BrowserHarness } from '../helpers/browser';

let harness: BrowserHarness;
beforeAll(async () => {
  harness = await startBrowserHarness();
}, 60_000);
afterAll(() => harness?.close());

describe('signing in', () => {
  it('when the demo owner signs in, then the studio name shows and the page loads nothing from other hosts', async () => {
    const page = await harness.newPage();
    const foreign: string[] = [];
    page.on('request', (request) => {
      if (!request.url().startsWith(harness.baseUrl) && !request.url().startsWith('data:')) foreign.push(request.url());
    });
    await signInAs(page, 'owner@demo.test');
    await page.getByRole('heading', { name: 'Fernhollow Workshop' }).waitFor();
    await expect(page.getByRole('button', { name: 'Switch studio' }).textContent()).resolves.toContain('Fernhollow Workshop');
    await expect(page.getByRole('link', { name: 'Studio settings' }).count()).resolves.toBe(1);
    await page.screenshot({ path: path.join(screenshotDir, 'home-owner.png') });
    expect(foreign).toEqual([]);
    await page.context().close();
  }, 30_000);

  it('when the password is wrong, then the form says so and stays on sign-in', async () => {
    const page = await harness.newPage();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill('owner@demo.test');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('Wrong e-mail or password').first().waitFor();
    expect(page.url()).toContain('/sign-in');
    await page.context().close();
  }, 30_000);

  it('when crew signs in, then studio settings are not offered, and signing out returns to sign-in', async () => {
    const page = await harness.newPage();
    await signInAs(page, 'crew@demo.test');
    await page.getByRole('heading', { name: 'Fernhollow Workshop' }).waitFor();
    await expect(page.getByRole('link', { name: 'Studio settings' }).count()).resolves.toBe(0);
    await page.getByRole('button', { name: 'Account menu' }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto('/');
    await page.waitForURL(/\/sign-in/);
    await page.context().close();
  }, 30_000);

  it('when someone signs up, then they land in their new studio as owner', async () => {
    const page = await harness.newPage();
    await page.goto('/sign-up');
    await page.getByLabel('Your name').fill('Rowan Test');
    await page.getByLabel('E-mail').fill(`rowan-${Date.now()}@example.test`);
    await page.getByLabel('Password').fill('a-long-password');
    await page.getByLabel('Studio name').fill('Quarry Hill Makers');
    await page.getByRole('button', { name: 'Create studio' }).click();
    await page.getByRole('heading', { name: 'Quarry Hill Makers' }).waitFor();
    await page.context().close();
  }, 30_000);
});
