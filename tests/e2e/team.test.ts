import path from 'node:path';
import type { Knex } from 'knex';
import { startMailFake, type MailFake } from '../../server/mail/mail-fake';
import { createDb } from '../../server/db';
import { e2eDatabaseName } from '../helpers/global-setup';
import { screenshotDir, signInAs, startBrowserHarness, type BrowserHarness } from '../helpers/browser';
import { makeStudio, testConfig, uniqueEmail } from '../helpers/test-app';

let harness: BrowserHarness;
let mailFake: MailFake;
let mailDb: Knex;
beforeAll(async () => {
  // The app under test sends real SMTP to a fake on a free port; it keeps mail in the e2e database.
  mailDb = createDb(testConfig({ DB_NAME: e2eDatabaseName() }));
  mailFake = await startMailFake(mailDb, 0);
  process.env['SMTP_PORT'] = String(mailFake.port);
  harness = await startBrowserHarness();
}, 60_000);
afterAll(async () => {
  await harness?.close();
  await mailFake?.close();
  await mailDb?.destroy();
});

describe('team, mailbox and feeds in the browser', () => {
  it('when the owner invites a partner, then the partner follows the captured mail, signs up, joins and makes a feed', async () => {
    const partnerEmail = uniqueEmail('new-partner');
    const owner = await harness.newPage();
    await signInAs(owner, 'owner@demo.test');
    await owner.getByRole('link', { name: 'Team' }).click();
    await owner.getByRole('heading', { name: 'Team' }).waitFor();
    await owner.getByRole('cell', { name: 'partner@demo.test' }).waitFor();
    await owner.getByLabel('Their e-mail').fill(partnerEmail);
    await owner.getByRole('combobox', { name: 'Role', exact: true }).click();
    await owner.getByRole('option', { name: 'partner' }).click();
    await owner.getByRole('button', { name: 'Send invitation' }).click();
    await owner.getByText(`${partnerEmail} · partner`).waitFor();
    // The invitation's expiry in the studio's own time (Chicago for the demo), not GMT.
    await owner.getByText(/until \w{3} \d{1,2}, \d{4}, \d{1,2}:\d{2} [AP]M studio time/).first().waitFor();
    // The emptied field is ready for the next address, not shown as an error.
    expect(await owner.getByLabel('Their e-mail').inputValue()).toBe('');
    await expect(owner.locator('form.invite mat-form-field.mat-form-field-invalid').count()).resolves.toBe(0);
    await expect(owner.locator('form.invite mat-error').count()).resolves.toBe(0);
    await owner.screenshot({ path: path.join(screenshotDir, 'team-owner.png') });

    await owner.getByRole('link', { name: 'Mailbox' }).click();
    await owner.getByRole('button', { name: /invites you to Fernhollow Workshop/ }).first().click();
    const link = owner.getByTestId('mail-text').getByRole('link', { name: /\/invitations\// });
    const href = (await link.first().getAttribute('href'))!;
    expect(href).toMatch(/\/invitations\/[A-Za-z0-9_-]{40,}$/);
    await owner.screenshot({ path: path.join(screenshotDir, 'mailbox-owner.png') });
    await owner.context().close();

    const partner = await harness.newPage();
    await partner.goto(new URL(href).pathname);
    await partner.getByText('You are invited to join').waitFor();
    await expect(partner.getByText(`The invitation is for ${partnerEmail}`).count()).resolves.toBe(1);
    await partner.getByLabel('Your name').fill('Ash Partner');
    await partner.getByLabel('Password').fill('a-long-partner-password');
    await partner.getByRole('button', { name: 'Sign up and join' }).click();
    await partner.waitForURL(new RegExp(`/studios/${harness.demoStudioId}(/|$)`));
    await expect(partner.getByRole('button', { name: 'Switch studio' }).textContent()).resolves.toContain('Fernhollow Workshop');
    // The mailbox shows a member their own mail: the invitation addressed to them, and nothing else.
    await partner.getByRole('link', { name: 'Mailbox' }).click();
    await partner.getByRole('button', { name: /invites you to Fernhollow Workshop/ }).waitFor();
    for (const address of await partner.getByRole('list', { name: 'Captured mail' }).locator('[matListItemLine]').allTextContents()) expect(address).toContain(partnerEmail);

    await partner.getByRole('link', { name: 'Feeds' }).click();
    await partner.getByRole('button', { name: 'Make a feed' }).click();
    const url = (await partner.getByTestId('feed-url').textContent())!.trim();
    expect(url).toMatch(/\/feeds\/[A-Za-z0-9_-]+\.ics$/);
    await partner.getByRole('img', { name: 'QR code of the feed link' }).waitFor();
    await expect(partner.getByRole('link', { name: 'Open in calendar app' }).getAttribute('href')).resolves.toMatch(/^webcal:\/\//);
    const feed = await partner.request.get(new URL(url).pathname);
    expect(feed.status()).toBe(200);
    expect(feed.headers()['content-type']).toBe('text/calendar; charset=utf-8');
    expect(await feed.text()).toContain('X-WR-CALNAME:Fernhollow Workshop · my steps (Ash Partner)');
    await partner.screenshot({ path: path.join(screenshotDir, 'feeds-partner.png') });
    await partner.context().close();
  }, 60_000);

  it('when a member forgets the password, then the mailed link sets a new one they can sign in with', async () => {
    // A member of their own (not a demo sign-in, which other browser tests use).
    const { members } = await makeStudio(mailDb, ['crew'], 'Reset test studio');
    const email = members.crew.email;
    const page = await harness.newPage();
    await page.goto('/sign-in');
    await page.getByRole('link', { name: 'Forgot password?' }).click();
    await page.getByText('We e-mail you a link').waitFor();
    await page.getByLabel('E-mail').fill(email);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByText('If an account exists for that address').waitFor();
    let text = '';
    for (let attempt = 0; attempt < 50 && !text; attempt++) {
      const row = await mailDb('dev_mailbox').where('to', email).andWhere('subject', 'like', 'Reset%').orderBy('id', 'desc').first();
      text = row?.text ?? '';
      if (!text) await new Promise((resolve) => setTimeout(resolve, 100));
    }
    const resetPath = new URL(/https?:\/\/\S+\/reset-password\/[A-Za-z0-9_-]+/.exec(text)![0]).pathname;
    await page.goto(resetPath);
    await page.getByLabel('New password').fill('crew-new-password-1');
    await page.getByRole('button', { name: 'Set the password' }).click();
    await page.getByText('Your password is changed').waitFor();
    await signInAs(page, email, 'crew-new-password-1');
    await page.context().close();
  }, 60_000);
});
