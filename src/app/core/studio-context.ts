import { httpResource } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import type { ResolveFn } from '@angular/router';
import type { StudioSettings } from '@shared/contracts/studios';
import { SessionStore } from './session-store';

/** The studio the user is working in (from the URL) and its settings. */
@Injectable({ providedIn: 'root' })
export class StudioContext {
  private readonly session = inject(SessionStore);
  private readonly current = signal<number | null>(null);

  readonly studioId = this.current.asReadonly();
  readonly role = computed(() => {
    const id = this.current();
    return id === null ? null : this.session.roleIn(id);
  });
  readonly isOwner = computed(() => this.role() === 'owner');
  readonly canEdit = computed(() => this.role() === 'owner' || this.role() === 'partner');
  readonly settings = httpResource<StudioSettings>(() => {
    const id = this.current();
    return id === null ? undefined : `/api/studios/${id}`;
  });

  /** The API base of the current studio; only call where a studio is open. */
  readonly base = computed(() => `/api/studios/${this.current()}`);

  select(studioId: number): void {
    this.current.set(studioId);
  }
}

/**
 * Resolver of /studios/:studioId (again whenever the id changes): opens the studio of the address
 * before its pages are made, so its settings and a page's own loads are asked for as the first
 * render starts. Opened from the shell instead, they waited for the whole first render (a few
 * hundred milliseconds while the app's code is cold).
 */
export const openStudio: ResolveFn<number> = (route) => {
  const studioId = Number(route.paramMap.get('studioId'));
  inject(StudioContext).select(studioId);
  return studioId;
};
