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
import { fieldError, zodValidator } from '../ui/zod-validator';
import { FormSubmission } from '../ui/form-submission';

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
  private readonly submission = new FormSubmission(this.form);
  protected readonly isBusy = this.submission.isBusy;
  protected readonly formError = this.submission.formError;
  protected readonly answer = signal<string | null>(null);

  protected submit(): Promise<void> {
    return this.submission.run(async () => {
      await ensureXsrfCookie(this.http);
      const response = await firstValueFrom(this.http.post<{ message: string }>('/api/auth/password-reset', this.form.getRawValue()));
      this.answer.set(response.message);
    });
  }
}
