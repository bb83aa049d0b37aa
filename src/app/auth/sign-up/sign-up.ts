import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { signupRequest, type SignupAnswer } from '@shared/contracts/auth';
import { ensureXsrfCookie } from '../../account/ensure-xsrf';
import { SessionStore } from '../../core/session-store';
import { fieldError, zodValidator } from '../../ui/zod-validator';
import { FormSubmission } from '../../ui/form-submission';

function browserTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

/** The country of the browser's language ("en-GB" → GB), or US when it names none. */
function browserCountry(): string {
  try {
    return new Intl.Locale(navigator.language).maximize().region ?? 'US';
  } catch {
    return 'US';
  }
}

@Component({
  selector: 'kc-sign-up',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule],
  templateUrl: './sign-up.html',
  styleUrl: '../auth-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignUp {
  private readonly http = inject(HttpClient);
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', zodValidator(signupRequest.shape.name)],
    email: ['', zodValidator(signupRequest.shape.email)],
    password: ['', zodValidator(signupRequest.shape.password)],
    studioName: ['', zodValidator(signupRequest.shape.studioName)],
    // Where the studio is, from the browser's own settings at first: its time zone gives the studio
    // its today, the country and region its public holidays. Both can be changed in the settings.
    timezone: [browserTimeZone()],
    country: [browserCountry(), zodValidator(signupRequest.shape.country)],
    region: [''],
  });
  protected readonly timezones = Intl.supportedValuesOf('timeZone');
  private readonly submission = new FormSubmission(this.form);
  protected readonly isBusy = this.submission.isBusy;
  protected readonly formError = this.submission.formError;
  protected readonly fieldError = fieldError;
  /** The server's answer when the sign-up did not sign anyone in (the address has an account). */
  protected readonly notice = signal<string | null>(null);

  /**
   * The server answers every sign-up alike; only a new address comes back signed in, so the session
   * says whether to open the new studio or to point to the mail.
   */
  protected submit(): Promise<void> {
    return this.submission.run(async () => {
      await ensureXsrfCookie(this.http);
      const { region, ...rest } = this.form.getRawValue();
      const request = { ...rest, country: rest.country.trim().toUpperCase(), region: region.trim().toUpperCase() || null };
      const answer = await firstValueFrom(this.http.post<SignupAnswer>('/api/auth/signup', request));
      this.session.forget();
      const me = await this.session.load();
      const isNewAccount = me?.user.email === request.email.trim().toLowerCase() && me.studios.length > 0;
      if (isNewAccount) await this.router.navigate(['/studios', me.studios[0].id]);
      else this.notice.set(answer.message);
    });
  }
}
