import path from 'node:path';
import { addDays } from '@shared/calendar/dates';
import { screenshotDir, signInAs, startBrowserHarness, todayIso, type BrowserHarness } from '../helpers/browser';

const templateName = 'Wrenfold porch bench';

let harness: BrowserHarness;
beforeAll(async () => {
  harness = await startBrowserHarness();
}, 60_000);
afterAll(async () => {
  // The demo studio keeps only its own templates for the other browser tests.
  await harness?.app.db('runway_templates').where({ studio_id: harness.demoStudioId, name: templateName }).delete();
  await harness?.close();
});

describe('runway templates', () => {
  it('when a partner on a phone copies a built-in template, renames a step and saves, then the plan dialog plans from it', async () => {
    const page = await harness.newPage({ viewport: { width: 390, height: 844 } });
    await signInAs(page, 'partner@demo.test');
    await page.goto(`/studios/${harness.demoStudioId}/templates`);
    const bench = page.locator('mat-card', { hasText: 'Bench-made piece' });
    await bench.getByRole('button', { name: 'Copy to edit' }).click();
    const editor = page.locator('kc-template-editor');
    await editor.getByLabel('Template name').fill(templateName);
    await editor.getByLabel('Step name').first().fill('Sketch and cut list');
    await editor.getByLabel('Work days').first().fill('3');
    await page.screenshot({ path: path.join(screenshotDir, 'templates-editor-phone.png'), fullPage: true });
    // The page fits the phone: nothing scrolls sideways.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await editor.getByRole('button', { name: 'Save template' }).click();
    await page.getByText(`${templateName} saved`).waitFor();
    const card = page.locator('mat-card', { hasText: templateName });
    await card.getByText('Sketch and cut list').waitFor();
    const stored = await harness.app.db('runway_templates').where({ studio_id: harness.demoStudioId, name: templateName }).first();
    expect(JSON.parse(stored.steps)[0]).toMatchObject({ name: 'Sketch and cut list', workDays: 3 });
    await page.context().close();

    const desk = await harness.newPage();
    await signInAs(desk, 'partner@demo.test');
    await desk.goto(`/studios/${harness.demoStudioId}/calendar`);
    await desk.getByRole('button', { name: 'Plan runway' }).click();
    const dialog = desk.getByRole('dialog');
    await dialog.getByLabel('Template').click();
    await desk.getByRole('option', { name: templateName }).click();
    await dialog.locator('mat-button-toggle', { hasText: 'A date' }).click();
    const [year, month, day] = addDays(todayIso(), 120).split('-').map(Number);
    await dialog.getByLabel('Anchor date').fill(`${month}/${day}/${year}`);
    await dialog.locator('.steps li', { hasText: 'Sketch and cut list' }).waitFor();
    await desk.screenshot({ path: path.join(screenshotDir, 'templates-plan-dialog.png') });
    await desk.context().close();
  }, 90_000);
});
