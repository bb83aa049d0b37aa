import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import { StudioContext } from '../../core/studio-context';
import { ThemeList } from './theme-list';

async function settle(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
}

describe('ThemeList', () => {
  it("when a theme's heat comes from some of its series, then the list says how many count; a theme without one says so", async () => {
    TestBed.configureTestingModule({
      imports: [ThemeList],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    TestBed.inject(StudioContext).select(7);
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ThemeList);
    fixture.detectChanges();
    await settle();
    http.match('/api/studios/7').forEach((request) => request.flush({}));
    const theme = { status: 'idea', target: null, seriesIds: [1, 2, 3], items: [], version: 1 };
    http.expectOne('/api/studios/7/themes').flush([
      { ...theme, id: 1, name: 'Paper lanterns', score: { heat: 62, verdict: 'rising', membersUsed: 2, membersTotal: 3 } },
      { ...theme, id: 2, name: 'Cork maps', score: { heat: null, verdict: 'not-enough-history', membersUsed: 0, membersTotal: 3 } },
    ]);
    await settle();
    fixture.detectChanges();
    const heats = [...(fixture.nativeElement as HTMLElement).querySelectorAll('td.num')].map((cell) => cell.textContent!.replace(/\s+/g, ' ').trim());
    expect(heats).toEqual(['62 · 2 of 3', 'no heat yet']);
  });
});
