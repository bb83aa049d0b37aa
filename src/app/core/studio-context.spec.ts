import { Component } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { openStudio, StudioContext } from './studio-context';

@Component({ template: 'page' })
class Page {
  /** The studio open when the page was made. */
  readonly studioAtStart = TestBed.inject(StudioContext).studioId();
}

describe('openStudio', () => {
  it('when an address under /studios/:studioId opens, then that studio is open before its page is made, and again when the id changes', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'studios/:studioId', resolve: { openedStudio: openStudio }, children: [{ path: 'calendar', component: Page }, { path: 'themes', component: Page }] }]),
      ],
    });
    const harness = await RouterTestingHarness.create();
    const context = TestBed.inject(StudioContext);
    const first = await harness.navigateByUrl('/studios/7/calendar', Page);
    expect(first.studioAtStart).toBe(7);
    const other = await harness.navigateByUrl('/studios/9/themes', Page);
    expect(other.studioAtStart).toBe(9);
    expect(context.studioId()).toBe(9);
    TestBed.tick();
    // The settings of the open studio are asked for (the one of 7 was cancelled when 9 opened).
    TestBed.inject(HttpTestingController).expectOne('/api/studios/9');
  });
});
