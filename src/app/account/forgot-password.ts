import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { passwordResetRequest } from '@shared/contracts/team';
import { ensureXsrfCookie } from './ensure-xsrf';
import { applyServerIssues } from '../core/api-error';
import { fieldError, zodValidator } from '../ui/zod-validator';

@Component({
  selector: 'kc-forgot-password',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  templateUrl: './forgot-password.html',
  styleUrl: '../auth/auth-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPassword {
  private readonly http = inject(HttpClient);
  protected readonly form = inject(NonNullableFormBuilder).group({ email: ['', zodValidator(passwordResetRequest.shape.email)] });
  protected readonly fieldError = fieldError;
  protected readonly isBusy = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected readonly answer = signal<string | null>(null);

  protected async submit(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.isBusy()) return;
    this.isBusy.set(true);
    this.formError.set(null);
    try {
      await ensureXsrfCookie(this.http);
      const response = await firstValueFrom(this.http.post<{ message: string }>('/api/auth/password-reset', this.form.getRawValue()));
      this.answer.set(response.message);
    } catch (error) {
      this.formError.set(applyServerIssues(this.form, error));
    } finally {
      this.isBusy.set(false);
    }
  }
}
