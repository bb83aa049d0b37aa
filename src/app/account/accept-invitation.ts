import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { invitationSignupRequest, type InvitationAccepted, type InvitationPreview } from '@shared/contracts/team';
import { ensureXsrfCookie } from './ensure-xsrf';
import { applyServerIssues, messageOf } from '../core/api-error';
import { SessionStore } from '../core/session-store';
import { fieldError, zodValidator } from '../ui/zod-validator';
import { valueOr } from '../core/resource-value';

/** /invitations/:token — the link in the invitation e-mail: sign up or sign in, then join. */
@Component({
  selector: 'kc-accept-invitation',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  templateUrl: './accept-invitation.html',
  styleUrl: '../auth/auth-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvitation {
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  protected readonly session = inject(SessionStore);

  readonly token = input.required<string>();

  protected readonly preview = httpResource<InvitationPreview>(() => `/api/invitations/${encodeURIComponent(this.token())}`);
  protected readonly previewError = computed(() => {
    const error = this.preview.error();
    return error ? messageOf(error) : null;
  });
  protected readonly signedInAs = computed(() => this.session.user()?.email ?? null);
  protected readonly isRightAccount = computed(() => this.signedInAs() !== null && this.signedInAs() === valueOr(this.preview, null)?.email);
  protected readonly isBusy = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected readonly fieldError = fieldError;
  protected readonly passwordForm = inject(NonNullableFormBuilder).group({ password: [''] });

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', zodValidator(invitationSignupRequest.shape.name)],
    password: ['', zodValidator(invitationSignupRequest.shape.password)],
  });

  constructor() {
    void this.session.load();
  }

  protected async accept(): Promise<void> {
    await this.join(() => firstValueFrom(this.http.post<InvitationAccepted>(`/api/invitations/${encodeURIComponent(this.token())}/accept`, {})));
  }

  protected async signUp(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    await this.join(() => firstValueFrom(this.http.post<InvitationAccepted>(`/api/invitations/${encodeURIComponent(this.token())}/signup`, this.form.getRawValue())));
  }

  /** An invitee with an account signs in right here, with the invited address, then joins. */
  protected async signInAndAccept(email: string): Promise<void> {
    const password = this.passwordForm.controls.password.value;
    if (!password) {
      this.formError.set('Enter your password');
      return;
    }
    await this.join(async () => {
      await this.session.signIn({ email, password });
      return firstValueFrom(this.http.post<InvitationAccepted>(`/api/invitations/${encodeURIComponent(this.token())}/accept`, {}));
    });
  }

  protected async signOut(): Promise<void> {
    await this.session.signOut();
  }

  private async join(request: () => Promise<InvitationAccepted>): Promise<void> {
    if (this.isBusy()) return;
    this.isBusy.set(true);
    this.formError.set(null);
    try {
      await ensureXsrfCookie(this.http);
      const accepted = await request();
      this.session.forget();
      await this.session.load();
      // The calendar is where a new member's work is; the shell falls back to the studio home.
      await this.router.navigate(['/studios', accepted.studioId, 'calendar']);
    } catch (error) {
      this.formError.set(applyServerIssues(this.form, error));
    } finally {
      this.isBusy.set(false);
    }
  }
}
