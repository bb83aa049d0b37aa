import type { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { RunwayTemplateView } from '@shared/contracts/runways';
import { createSignedIn } from '../markets/markets-testing';
import { TemplatesPage } from './templates-page';

const base = '/api/studios/5/runway-templates';

const builtIn: RunwayTemplateView = {
  id: 'video-only',
  name: 'Video only',
  isBuiltIn: true,
  version: 1,
  steps: [
    { name: 'Edit', kind: 'content', workDays: 2, hoursPerDay: 4, cureDays: 0, cautions: [] },
    { name: 'Publish', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0, cautions: [] },
  ],
};

const own: RunwayTemplateView = {
  id: 12,
  name: 'Lantern kit',
  isBuiltIn: false,
  version: 3,
  steps: [{ name: 'Cut', kind: 'build', workDays: 2, hoursPerDay: 5, cureDays: 1, cautions: ['Vent fumes.'] }],
};

const settle = async (fixture: { whenStable(): Promise<unknown> }) => {
  await fixture.whenStable();
  await new Promise((resolve) => setTimeout(resolve, 20));
  await fixture.whenStable();
};

async function setUp(role: 'partner' | 'crew') {
  const { fixture, http } = await createSignedIn(TemplatesPage, role);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  http.expectOne(base).flush([builtIn, own]);
  await settle(fixture);
  return { fixture, loader, http, element: fixture.nativeElement as HTMLElement };
}

/** The inputs of every form field labelled `label`, in page order. */
const inputs = async (loader: HarnessLoader, label: string) =>
  Promise.all((await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: label }))).map((field) => field.getControl(MatInputHarness)));

describe('TemplatesPage', () => {
  it('when crew open the page, then both templates show their steps and cautions, and no button changes anything', async () => {
    const { element, loader } = await setUp('crew');
    const text = element.textContent!.replace(/\s+/g, ' ');
    expect(text).toContain('Video only');
    expect(text).toContain('Built in · 2 steps · 2 work days');
    expect(text).toContain('This studio · 1 steps · 2 work days + 1 cure days');
    expect(text).toContain('Vent fumes.');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /Copy|Edit|Delete|New template/ }))).toHaveLength(0);
  });

  it('when a partner copies a built-in template, adds a step and saves, then POST carries the copied steps and the new one', async () => {
    const { fixture, loader, http } = await setUp('partner');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Copy to edit' }))).click();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a step/ }))).click();
    const names = await inputs(loader, 'Step name');
    expect(names).toHaveLength(3);
    await names[2]!.setValue('Share the clip');
    await (await inputs(loader, 'Cautions, one a line'))[2]!.setValue('Film with guards on.\n\nFollow the tool manual.');
    expect(fixture.nativeElement.textContent).toContain('do not replace your machine and tool manuals');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save template' }))).click();

    const request = http.expectOne((req) => req.method === 'POST' && req.url === base);
    expect(request.request.body).toEqual({
      name: 'Video only (copy)',
      steps: [
        { name: 'Edit', kind: 'content', workDays: 2, hoursPerDay: 4, cureDays: 0, cautions: [] },
        { name: 'Publish', kind: 'launch', workDays: 0, hoursPerDay: 0, cureDays: 0, cautions: [] },
        { name: 'Share the clip', kind: 'build', workDays: 1, hoursPerDay: 4, cureDays: 0, cautions: ['Film with guards on.', 'Follow the tool manual.'] },
      ],
    });
    request.flush({ ...own, id: 13, name: 'Video only (copy)' });
    // The list reloads; waiting for stability would wait on that open request.
    await new Promise((resolve) => setTimeout(resolve, 50));
    TestBed.tick();
    http.expectOne(base).flush([builtIn, own]);
    await settle(fixture);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Save template' }))).toHaveLength(0);
  });

  it('when a partner moves a step up in their own template and someone else saved meanwhile, then PUT sends the version and the 409 is said', async () => {
    const { fixture, loader, http, element } = await setUp('partner');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Edit' }))).click();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a step/ }))).click();
    await (await inputs(loader, 'Step name'))[1]!.setValue('Design');
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Move step 2 up"]' }))).click();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save template' }))).click();

    const request = http.expectOne((req) => req.method === 'PUT' && req.url === `${base}/12`);
    expect(request.request.body.version).toBe(3);
    expect(request.request.body.steps.map((step: { name: string }) => step.name)).toEqual(['Design', 'Cut']);
    request.flush({ error: { code: 'version_conflict', message: 'Someone else changed this template' } }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    expect(element.querySelector('[role=alert]')!.textContent).toContain('Someone else changed this template meanwhile');
  });

  it('when the server refuses a step field, then its message sits under that field', async () => {
    const { fixture, loader, http, element } = await setUp('partner');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Edit' }))).click();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save template' }))).click();
    http
      .expectOne(`${base}/12`)
      .flush({ error: { code: 'invalid_input', message: 'Invalid', issues: [{ path: ['steps', 0, 'name'], message: 'Step name: use plain words' }] } }, { status: 400, statusText: 'Bad Request' });
    await settle(fixture);
    expect(element.querySelector('mat-error')!.textContent).toContain('Step name: use plain words');
  });
});
