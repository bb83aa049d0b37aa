import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { passwordResetConfirm } from '@shared/contracts/team';
import { ensureXsrfCookie } from './ensure-xsrf';
import { SessionStore } from '../core/session-store';
import { fieldError, zodValidator } from '../ui/zod-validator';
import { FormSubmission } from '../ui/form-submission';

/** /reset-password/:token — the link in the reset e-mail. */
@Component({
  selector: 'kc-reset-password',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  templateUrl: './reset-password.html',
  styleUrl: '../auth/auth-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPassword {
  private readonly http = inject(HttpClient);
  private readonly session = inject(SessionStore);
  readonly token = input.required<string>();
  protected readonly form = inject(NonNullableFormBuilder).group({ password: ['', zodValidator(passwordResetConfirm.shape.password)] });
  protected readonly fieldError = fieldError;
  private readonly submission = new FormSubmission(this.form);
  protected readonly isBusy = this.submission.isBusy;
  protected readonly isDone = signal(false);
  protected readonly formError = this.submission.formError;

  protected submit(): Promise<void> {
    return this.submission.run(async () => {
      await ensureXsrfCookie(this.http);
      await firstValueFrom(this.http.post(`/api/auth/password-reset/${encodeURIComponent(this.token())}`, this.form.getRawValue()));
      this.session.forget();
      this.isDone.set(true);
    });
  }
}
