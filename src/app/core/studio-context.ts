import { httpResource } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import type { IsoDate } from '@shared/calendar/dates';
import type { StudioSettings } from '@shared/contracts/studios';
import { isoOfLocalDate } from '../calendar/calendar-dates';
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

  /**
   * The open studio's today: the date the server's clock gave for it (in the studio's time zone),
   * turning at the studio's midnight. A member far from the studio sees the studio's days, and a
   * server whose date is pinned (KERFCAST_TODAY) is followed. Before a studio is open, the browser's.
   */
  today(): IsoDate {
    const id = this.current();
    return (id === null ? null : this.session.todayIn(id)) ?? isoOfLocalDate(new Date());
  }

  /** The API base of the current studio; only call where a studio is open. */
  readonly base = computed(() => `/api/studios/${this.current()}`);

  select(studioId: number): void {
    this.current.set(studioId);
  }
}
