import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { loginRequest } from '@shared/contracts/auth';
import { applyServerIssues } from '../../core/api-error';
import { SessionStore } from '../../core/session-store';
import { fieldError, zodValidator } from '../../ui/zod-validator';

@Component({
  selector: 'kc-sign-in',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  templateUrl: './sign-in.html',
  styleUrl: '../auth-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignIn {
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  /** Where to go after signing in (from the query string). */
  readonly next = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', zodValidator(loginRequest.shape.email)],
    password: ['', zodValidator(loginRequest.shape.password)],
  });
  protected readonly isBusy = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected readonly fieldError = fieldError;

  protected async submit(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.isBusy()) return;
    this.isBusy.set(true);
    this.formError.set(null);
    try {
      const me = await this.session.signIn(this.form.getRawValue());
      const next = this.next();
      const target = next && next.startsWith('/studios/') ? next : me.studios.length ? `/studios/${me.studios[0].id}` : '/sign-up';
      await this.router.navigateByUrl(target);
    } catch (error) {
      this.formError.set(applyServerIssues(this.form, error));
    } finally {
      this.isBusy.set(false);
    }
  }
}
