import { addDays } from '@shared/calendar/dates';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS, provideNativeDateAdapter } from '@angular/material/core';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { StudioContext } from '../core/studio-context';
import { SessionStore } from '../core/session-store';
import { PlanRunwayDialog, type PlanRunwayInput } from './plan-runway-dialog';

const base = '/api/studios/7';
/** The studio's today as the server states it, years from the browser's date: the default anchor is this. */
const studioToday = '2031-05-14';

const mothersDay = [{ kind: 'occasion', value: 'mothers-day', key: 'mothers-day', name: "Mother's Day", date: '2027-05-09' }];

async function setUp(data: PlanRunwayInput, upcoming: object[] = mothersDay) {
  const close = jest.fn();
  TestBed.configureTestingModule({
    imports: [PlanRunwayDialog],
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      provideNativeDateAdapter(),
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      { provide: MAT_DIALOG_DATA, useValue: data },
      { provide: MatDialogRef, useValue: { close } },
    ],
  });
  const http = TestBed.inject(HttpTestingController);
  const loading = TestBed.inject(SessionStore).load();
  http.expectOne('/api/auth/me').flush({ user: { id: 2, email: 'p@example.test', name: 'Tobin Ashgrove' }, studios: [{ id: 7, name: 'Bench', role: 'partner', timezone: 'America/Chicago', today: studioToday }] });
  await loading;
  TestBed.inject(StudioContext).select(7);
  const fixture = TestBed.createComponent(PlanRunwayDialog);
  fixture.detectChanges();
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
  http.match(base).forEach((request) => request.flush({}));
  http.expectOne(`${base}/runway-templates`).flush([{ id: 'default', name: 'Laser-cut decor line', isBuiltIn: true, steps: [], version: 1 }]);
  http.expectOne(`${base}/occasions/upcoming`).flush(upcoming);
  return { fixture, http, close, loader: TestbedHarnessEnvironment.loader(fixture) };
}

async function settle(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
}

// The first test also compiles the dialog and Material.
jest.setTimeout(20_000);

describe('PlanRunwayDialog', () => {
  it('when opened for a theme, then it previews the dated steps and warnings and creates the runway in the tray', async () => {
    const { fixture, http, close, loader } = await setUp({ themeId: 9, themeName: 'Herb garden' });
    const preview = http.expectOne(`${base}/runways/preview`);
    expect(preview.request.body).toEqual({ anchorDate: addDays(studioToday, 42), offsetDays: 0, templateId: 'default' });
    preview.flush({
      launch: '2026-12-01',
      start: '2026-11-02',
      steps: [
        { name: 'Design', kind: 'build', start: '2026-11-02', end: '2026-11-04' },
        { name: 'Launch', kind: 'launch', start: '2026-12-01', end: '2026-12-01' },
      ],
      warnings: [{ code: 'too-short', message: 'The runway is too short by 5 work days' }],
    });
    await settle();
    const text = fixture.nativeElement.textContent;
    expect(text).toContain('Plan a runway for Herb garden');
    expect(text).toContain('Design');
    expect(text).toContain('Mon, Nov 2 – Wed, Nov 4');
    expect(text).toContain('The runway is too short by 5 work days');

    await (await loader.getHarness(MatRadioGroupHarness)).checkRadioButton({ label: 'In the tray, to drag onto days myself' });
    const create = [...fixture.nativeElement.querySelectorAll('button')].find((button: HTMLButtonElement) => button.textContent!.includes('Create runway')) as HTMLButtonElement;
    create.click();
    await settle();
    const request = http.expectOne(`${base}/runways`);
    expect(request.request.body).toEqual({ anchorDate: addDays(studioToday, 42), offsetDays: 0, templateId: 'default', themeId: 9, placement: 'tray' });
    request.flush({ id: 12 }, { status: 201, statusText: 'Created' });
    await settle();
    expect(close).toHaveBeenCalledWith({ id: 12 });
  });

  it('when the anchor is an occasion, then the preview plans back from its key', async () => {
    const { fixture, http } = await setUp({ themeId: 9, themeName: 'Herb garden', target: { kind: 'occasion', value: 'mothers-day' }, offsetDays: 14 });
    const preview = http.expectOne(`${base}/runways/preview`);
    expect(preview.request.body).toEqual({ anchor: { kind: 'occasion', value: 'mothers-day' }, offsetDays: 14, templateId: 'default' });
    preview.flush({ error: { code: 'invalid_input', message: 'No upcoming occasion mothers-day' } }, { status: 400, statusText: 'Bad Request' });
    await settle();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('No upcoming occasion mothers-day');
  });

  it("when the theme's target is a holiday key, then the field shows its coming day, and another kind of anchor plans from that kind's first day, not the old key", async () => {
    const upcoming = [
      { kind: 'holiday', value: 'halloween:2027-10-31', key: 'halloween', name: 'Halloween', date: '2027-10-31' },
      { kind: 'occasion', value: 'mothers-day:2027-05-09', key: 'mothers-day', name: "Mother's Day", date: '2027-05-09' },
    ];
    const { fixture, http, loader } = await setUp({ themeId: 9, themeName: 'Herb garden', target: { kind: 'holiday', value: 'halloween' } }, upcoming);
    await settle();
    await new Promise((resolve) => setTimeout(resolve, 300));
    const asked = http.match(`${base}/runways/preview`);
    expect(asked.at(-1)!.request.body).toEqual({ anchor: { kind: 'holiday', value: 'halloween:2027-10-31' }, offsetDays: 0, templateId: 'default' });
    asked.forEach((request) => request.flush({ launch: '2027-10-31', start: '2027-10-01', steps: [], warnings: [] }));
    await settle();
    fixture.detectChanges();
    const selects = await Promise.all((await loader.getAllHarnesses(MatSelectHarness)).map((select) => select.getValueText()));
    expect(selects).toContain('Halloween · Sun, Oct 31');

    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Occasion' }))).check();
    await new Promise((resolve) => setTimeout(resolve, 300));
    await settle();
    const switched = http.match(`${base}/runways/preview`);
    expect(switched.map((request) => request.request.body.anchor)).toEqual([{ kind: 'occasion', value: 'mothers-day:2027-05-09' }]);
  });
});
