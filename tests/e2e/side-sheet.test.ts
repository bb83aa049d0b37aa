import { signInAs, startBrowserHarness, type BrowserHarness } from '../helpers/browser';

let harness: BrowserHarness;
beforeAll(async () => {
  harness = await startBrowserHarness();
}, 60_000);
afterAll(() => harness?.close());

describe("a step's side sheet", () => {
  it.each([
    [1440, 900],
    [390, 844],
  ])('when it opens at %i px, then its close button and every field lie inside the window', async (width, height) => {
    const page = await harness.newPage({ viewport: { width, height } });
    await signInAs(page, 'partner@demo.test');
    await page.goto(`/studios/${harness.demoStudioId}/calendar`);
    await page.locator('button.chip[data-kind="build"], button.chip[data-kind="content"]').first().click();
    await page.locator('kc-event-sheet h2').waitFor();
    // The drawer slides in; measure once it has stopped.
    await page.waitForFunction(() => document.getAnimations().length === 0);
    const close = (await page.getByRole('button', { name: 'Close details' }).boundingBox())!;
    const rights = await page.locator('kc-event-sheet mat-form-field, kc-event-sheet button').evaluateAll((all) => all.map((one) => Math.round(one.getBoundingClientRect().right)));
    expect(close.x + close.width).toBeLessThanOrEqual(width);
    expect(rights.filter((right) => right > width)).toEqual([]);
    await page.context().close();
  }, 60_000);
});
