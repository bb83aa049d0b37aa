import { HttpClient } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { LoginRequest, MeResponse, SignupRequest } from '@shared/contracts/auth';

/** Who is signed in and which studios they belong to; the one source the shell and guards read. */
@Injectable({ providedIn: 'root' })
export class SessionStore {
  private readonly http = inject(HttpClient);
  private readonly me = signal<MeResponse | null>(null);
  private loaded: Promise<MeResponse | null> | null = null;

  readonly user = computed(() => this.me()?.user ?? null);
  readonly studios = computed(() => this.me()?.studios ?? []);
  readonly isSignedIn = computed(() => this.me() !== null);

  /** Loads the session once; later calls reuse the answer until sign-in or sign-out. */
  load(): Promise<MeResponse | null> {
    this.loaded ??= firstValueFrom(this.http.get<MeResponse>('/api/auth/me'))
      .then((me) => {
        this.me.set(me);
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

  async signUp(request: SignupRequest): Promise<MeResponse> {
    await this.ensureXsrfCookie();
    const me = await firstValueFrom(this.http.post<MeResponse>('/api/auth/signup', request));
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

  roleIn(studioId: number) {
    return this.studios().find((studio) => studio.id === studioId)?.role ?? null;
  }

  private remember(me: MeResponse): void {
    this.me.set(me);
    this.loaded = Promise.resolve(me);
  }

  // The server sets XSRF-TOKEN on any GET; make sure one happened before the first write.
  private async ensureXsrfCookie(): Promise<void> {
    if (!document.cookie.includes('XSRF-TOKEN=')) await firstValueFrom(this.http.get('/api/health')).catch(() => undefined);
  }
}
