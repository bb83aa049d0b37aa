import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestKey } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatChipGridHarness } from '@angular/material/chips/testing';
import type { StudioSettings } from '@shared/contracts/studios';
import { SessionStore } from '../core/session-store';
import { StudioContext } from '../core/studio-context';
import { StudioSettingsPage } from './studio-settings';

const settings: StudioSettings = {
  id: 5,
  name: 'Fernhollow Workshop',
  timezone: 'America/Chicago',
  country: 'US',
  region: null,
  weekStart: 1,
  workDays: [1, 2, 3, 4, 5],
  dailyCapacityHours: 6,
  holidaysOff: true,
  channels: ['market', 'booth', 'online'],
  version: 3,
  role: 'owner',
};

const settle = async (fixture: { whenStable(): Promise<unknown> }) => {
  await fixture.whenStable();
  await new Promise((resolve) => setTimeout(resolve, 20));
  await fixture.whenStable();
};

async function setUp(role: 'owner' | 'partner' | 'crew' = 'owner') {
  TestBed.configureTestingModule({ imports: [StudioSettingsPage], providers: [provideHttpClient(), provideHttpClientTesting()] });
  const http = TestBed.inject(HttpTestingController);
  const loading = TestBed.inject(SessionStore).load();
  http.expectOne('/api/auth/me').flush({ user: { id: 2, email: 'o@example.test', name: 'Wren Halloway' }, studios: [{ id: 5, name: 'Fernhollow Workshop', role }] });
  await loading;
  TestBed.inject(StudioContext).select(5);
  const fixture = TestBed.createComponent(StudioSettingsPage);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  TestBed.tick();
  http.match('/api/studios/5').forEach((request) => request.flush(settings));
  await settle(fixture);
  return { fixture, loader, http };
}

describe('StudioSettingsPage sales channels', () => {
  it('when the owner adds a channel and removes one, then the save sends the new list', async () => {
    const { fixture, loader, http } = await setUp();
    const grid = await loader.getHarness(MatChipGridHarness);
    expect(await Promise.all((await grid.getRows()).map((row) => row.getText()))).toEqual(['market', 'booth', 'online']);
    await (await grid.getInput())!.setValue('Gallery shop');
    await (await grid.getInput())!.sendSeparatorKey(TestKey.ENTER);
    const [, booth] = await grid.getRows();
    await booth.remove();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).click();
    const patch = http.expectOne('/api/studios/5');
    expect(patch.request.method).toBe('PATCH');
    expect(patch.request.body).toMatchObject({ channels: ['market', 'online', 'Gallery shop'], version: 3 });
    patch.flush({ ...settings, channels: ['market', 'online', 'Gallery shop'], version: 4 });
    await settle(fixture);
    expect(await Promise.all((await grid.getRows()).map((row) => row.getText()))).toEqual(['market', 'online', 'Gallery shop']);
  }, 20_000);

  it('when the same channel is added twice, then the field says so and nothing is sent', async () => {
    const { fixture, loader, http } = await setUp();
    const grid = await loader.getHarness(MatChipGridHarness);
    await (await grid.getInput())!.setValue('Market');
    await (await grid.getInput())!.sendSeparatorKey(TestKey.ENTER);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).click();
    await settle(fixture);
    http.expectNone('/api/studios/5');
    expect((fixture.nativeElement as HTMLElement).querySelector('.channels mat-error')?.textContent).toContain('Each channel once');
  }, 20_000);
});

describe('StudioSettingsPage for members who are not owners', () => {
  it('when crew open the settings, then the fields are read-only and the page says only owners change them', async () => {
    const { fixture, loader } = await setUp('crew');
    expect((fixture.nativeElement as HTMLElement).querySelector('.read-only')!.textContent).toContain("Only the studio's owners change these settings");
    const name = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>('input[formcontrolname="name"]')!;
    expect(name.disabled).toBe(true);
    expect(await (await loader.getHarness(MatButtonHarness.with({ text: 'Save settings' }))).isDisabled()).toBe(true);
  });
});
