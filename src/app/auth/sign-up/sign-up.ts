import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { signupRequest } from '@shared/contracts/auth';
import { SessionStore } from '../../core/session-store';
import { fieldError, zodValidator } from '../../ui/zod-validator';
import { FormSubmission } from '../../ui/form-submission';

@Component({
  selector: 'kc-sign-up',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  templateUrl: './sign-up.html',
  styleUrl: '../auth-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignUp {
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', zodValidator(signupRequest.shape.name)],
    email: ['', zodValidator(signupRequest.shape.email)],
    password: ['', zodValidator(signupRequest.shape.password)],
    studioName: ['', zodValidator(signupRequest.shape.studioName)],
  });
  private readonly submission = new FormSubmission(this.form);
  protected readonly isBusy = this.submission.isBusy;
  protected readonly formError = this.submission.formError;
  protected readonly fieldError = fieldError;

  protected submit(): Promise<void> {
    return this.submission.run(async () => {
      const me = await this.session.signUp(this.form.getRawValue());
      await this.router.navigate(['/studios', me.studios[0].id]);
    });
  }
}
