import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { loginRequest } from '@shared/contracts/auth';
import { SessionStore } from '../../core/session-store';
import { fieldError, zodValidator } from '../../ui/zod-validator';
import { FormSubmission } from '../../ui/form-submission';

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
  private readonly submission = new FormSubmission(this.form);
  protected readonly isBusy = this.submission.isBusy;
  protected readonly formError = this.submission.formError;
  protected readonly fieldError = fieldError;

  protected submit(): Promise<void> {
    return this.submission.run(async () => {
      const me = await this.session.signIn(this.form.getRawValue());
      const next = this.next();
      const target = next && next.startsWith('/studios/') ? next : me.studios.length ? `/studios/${me.studios[0].id}` : '/sign-up';
      await this.router.navigateByUrl(target);
    });
  }
}
