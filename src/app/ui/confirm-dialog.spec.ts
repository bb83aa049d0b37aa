import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { Confirmer } from './confirm-dialog';

async function settle(): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  TestBed.tick();
}

const buttonNamed = (name: string) => [...document.querySelectorAll<HTMLButtonElement>('mat-dialog-container button')].find((button) => button.textContent!.trim() === name)!;

describe('Confirmer', () => {
  beforeEach(() => TestBed.configureTestingModule({ providers: [{ provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }] }));

  it('when the user chooses the action, then it resolves true; when they cancel, false', async () => {
    const confirmer = TestBed.inject(Confirmer);
    const asked = confirmer.ask({ title: 'Revoke this feed?', message: 'Calendars that use it stop updating.', action: 'Revoke the feed' });
    await settle();
    expect(document.querySelector('mat-dialog-container h2')!.textContent).toBe('Revoke this feed?');
    buttonNamed('Revoke the feed').click();
    await settle();
    await expect(asked).resolves.toBe(true);

    const cancelled = confirmer.ask({ title: 'Delete the market?', message: 'Its days leave the calendar.', action: 'Delete the market' });
    await settle();
    buttonNamed('Cancel').click();
    await settle();
    await expect(cancelled).resolves.toBe(false);
  });
});
