import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { StudioContext } from '../core/studio-context';
import { ProfilePage } from './profile-page';

async function settle(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
}

describe('ProfilePage', () => {
  it("when a member asks for this week's agenda, then it is asked for in the open studio and the answer says where it went", async () => {
    TestBed.configureTestingModule({
      imports: [ProfilePage],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    TestBed.inject(StudioContext).select(7);
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ProfilePage);
    fixture.detectChanges();
    await settle();
    http.match('/api/studios/7').forEach((request) => request.flush({}));
    http.expectOne('/api/account/profile').flush({ email: 'juniper@example.test', name: 'Juniper Lake', weeklyAgenda: true });
    await settle();
    fixture.detectChanges();
    const button = [...(fixture.nativeElement as HTMLElement).querySelectorAll('button')].find((one) => one.textContent?.includes("Send me this week's agenda"))!;
    button.click();
    const asked = http.expectOne('/api/studios/7/agenda/preview');
    expect(asked.request.method).toBe('POST');
    asked.flush({ to: 'juniper@example.test', week: '2027-03-01' }, { status: 202, statusText: 'Accepted' });
    await settle();
    const snackBar = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toBe("This week's agenda is on its way to juniper@example.test");
  });
});
