import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { Type } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS, provideNativeDateAdapter } from '@angular/material/core';
import type { Role } from '@shared/contracts/auth';
import { SessionStore } from '../core/session-store';
import { StudioContext } from '../core/studio-context';

/**
 * For the component tests of this folder: `component` created for a member of studio 5 in `role`,
 * signed in, with the studio's settings answered (as empty) and its own first requests still open.
 */
export async function createSignedIn<T>(component: Type<T>, role: Role): Promise<{ fixture: ComponentFixture<T>; http: HttpTestingController }> {
  TestBed.configureTestingModule({
    imports: [component],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideNativeDateAdapter(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
  });
  const http = TestBed.inject(HttpTestingController);
  const loading = TestBed.inject(SessionStore).load();
  http.expectOne('/api/auth/me').flush({ user: { id: 2, email: 'p@example.test', name: 'Tobin Ashgrove' }, studios: [{ id: 5, name: 'Test bench', role }] });
  await loading;
  TestBed.inject(StudioContext).select(5);
  const fixture = TestBed.createComponent(component);
  TestBed.tick();
  http.match('/api/studios/5').forEach((request) => request.flush(null));
  return { fixture, http };
}
