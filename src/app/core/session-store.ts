import { HttpClient } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { addDays, daysBetween, isIsoDate, type IsoDate } from '@shared/calendar/dates';
import { dateInZone } from '@shared/calendar/zone-date';
import type { LoginRequest, MeResponse } from '@shared/contracts/auth';

/** Who is signed in and which studios they belong to; the one source the shell and guards read. */
@Injectable({ providedIn: 'root' })
export class SessionStore {
  private readonly http = inject(HttpClient);
  private readonly me = signal<MeResponse | null>(null);
  private loaded: Promise<MeResponse | null> | null = null;

  readonly user = computed(() => this.me()?.user ?? null);
  readonly studios = computed(() => this.me()?.studios ?? []);
  readonly isSignedIn = computed(() => this.me() !== null);
  /** Per studio, the server's today less the browser's date there, in days, taken when the answer came. */
  private readonly dayOffsets = signal<ReadonlyMap<number, number>>(new Map());

  /** Loads the session once; later calls reuse the answer until sign-in or sign-out. */
  load(): Promise<MeResponse | null> {
    this.loaded ??= firstValueFrom(this.http.get<MeResponse>('/api/auth/me'))
      .then((me) => {
        this.setMe(me);
        return me;
      })
      .catch(() => {
        this.me.set(null);
        return null;
      });
    return this.loaded;
  }

  async signIn(request: LoginRequest): Promise<MeResponse> {
    await this.ensureXsrfCookie();
    const me = await firstValueFrom(this.http.post<MeResponse>('/api/auth/login', request));
    this.remember(me);
    return me;
  }

  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.http.post('/api/auth/logout', {}));
    } finally {
      this.forget();
    }
  }

  forget(): void {
    this.me.set(null);
    this.loaded = null;
  }

  /**
   * A studio's today by the server's clock: the date the server gave, moved on by the days that have
   * turned in the studio's time zone since (the browser's clock only counts the days that pass).
   */
  todayIn(studioId: number): IsoDate | null {
    const studio = this.studios().find((one) => one.id === studioId);
    const days = this.dayOffsets().get(studioId);
    if (!studio?.timezone || days === undefined) return null;
    return addDays(dateInZone(new Date(), studio.timezone), days);
  }

  roleIn(studioId: number) {
    return this.studios().find((studio) => studio.id === studioId)?.role ?? null;
  }

  private setMe(me: MeResponse | null): void {
    const offsets = new Map<number, number>();
    const now = new Date();
    for (const studio of me?.studios ?? []) {
      // Older answers (and some tests) carry no today; the browser's date stands in then.
      if (studio.timezone && studio.today && isIsoDate(studio.today)) offsets.set(studio.id, daysBetween(dateInZone(now, studio.timezone), studio.today));
    }
    this.dayOffsets.set(offsets);
    this.me.set(me);
  }

  private remember(me: MeResponse): void {
    this.setMe(me);
    this.loaded = Promise.resolve(me);
  }

  // The server sets XSRF-TOKEN on any GET; make sure one happened before the first write.
  private async ensureXsrfCookie(): Promise<void> {
    if (!document.cookie.includes('XSRF-TOKEN=')) await firstValueFrom(this.http.get('/api/health')).catch(() => undefined);
  }
}
