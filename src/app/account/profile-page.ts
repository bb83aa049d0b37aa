import { HttpClient, httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, effect, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';
import { profilePatch, type ProfileView } from '@shared/contracts/team';
import { applyServerIssues, messageOf } from '../core/api-error';
import { StudioContext } from '../core/studio-context';
import { SessionStore } from '../core/session-store';
import { fieldError, zodValidator } from '../ui/zod-validator';
import { valueOr } from '../core/resource-value';

@Component({
  selector: 'kc-profile-page',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSlideToggleModule, MatButtonModule],
  templateUrl: './profile-page.html',
  styles: ['.profile { display: flex; flex-direction: column; gap: 12px; max-width: 520px; } .form-error { color: var(--mat-sys-error); }'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProfilePage {
  private readonly http = inject(HttpClient);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(SessionStore);
  protected readonly context = inject(StudioContext);
  protected readonly isSendingAgenda = signal(false);
  protected readonly profile = httpResource<ProfileView>(() => '/api/account/profile');
  protected readonly fieldError = fieldError;
  protected readonly isBusy = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', zodValidator(profilePatch.shape.name)],
    weeklyAgenda: [true],
  });

  constructor() {
    effect(() => {
      const profile = valueOr(this.profile, undefined);
      if (profile) this.form.reset({ name: profile.name, weeklyAgenda: profile.weeklyAgenda });
    });
  }

  /** This week's agenda mail, to me, now: to see what Monday's looks like. */
  protected async sendAgenda(): Promise<void> {
    if (this.isSendingAgenda() || this.context.studioId() === null) return;
    this.isSendingAgenda.set(true);
    try {
      const sent = await firstValueFrom(this.http.post<{ to: string }>(`${this.context.base()}/agenda/preview`, {}));
      this.snackBar.open(`This week's agenda is on its way to ${sent.to}`, undefined, { duration: 4000 });
    } catch (error) {
      this.snackBar.open(messageOf(error), 'Close', { duration: 6000 });
    } finally {
      this.isSendingAgenda.set(false);
    }
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.isBusy()) return;
    this.isBusy.set(true);
    this.formError.set(null);
    try {
      const saved = await firstValueFrom(this.http.patch<ProfileView>('/api/account/profile', this.form.getRawValue()));
      this.profile.set(saved);
      this.session.forget();
      await this.session.load();
      this.snackBar.open('Profile saved', undefined, { duration: 3000 });
    } catch (error) {
      this.formError.set(applyServerIssues(this.form, error));
    } finally {
      this.isBusy.set(false);
    }
  }
}
