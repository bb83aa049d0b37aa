import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter, Router } from '@angular/router';
import { signupAnswerMessage } from '@shared/contracts/auth';
import { SignUp } from './sign-up';

async function setUp() {
  TestBed.configureTestingModule({
    imports: [SignUp],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([{ path: '**', children: [] }])],
  });
  document.cookie = 'XSRF-TOKEN=test-token';
  const fixture = TestBed.createComponent(SignUp);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  await fixture.whenStable();
  const input = (name: string) => loader.getHarness(MatInputHarness.with({ selector: `[formControlName=${name}]` }));
  return {
    fixture,
    http: TestBed.inject(HttpTestingController),
    router: TestBed.inject(Router),
    fill: async (values: Record<string, string>) => {
      for (const [name, value] of Object.entries(values)) await (await input(name)).setValue(value);
    },
    submit: () => loader.getHarness(MatButtonHarness.with({ text: 'Create studio' })).then((button) => button.click()),
    fields: () => loader.getAllHarnesses(MatFormFieldHarness),
    text: () => (fixture.nativeElement as HTMLElement).textContent ?? '',
  };
}

const form = { name: 'Tamsel Orrin', email: 'tamsel@example.test', password: 'long-enough-pass', studioName: 'Wickerby' };
const settle = async (fixture: { whenStable(): Promise<unknown> }) => {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
};

describe('SignUp', () => {
  it('when the server answers and the session shows the new studio, then it opens that studio', async () => {
    const { fill, submit, http, router, fixture } = await setUp();
    const navigate = jest.spyOn(router, 'navigate');
    await fill(form);
    await submit();
    const request = http.expectOne('/api/auth/signup');
    // The studio's place comes along, from the browser's own time zone and language at first.
    expect(request.request.body).toEqual({ ...form, timezone: Intl.DateTimeFormat().resolvedOptions().timeZone, country: expect.stringMatching(/^[A-Z]{2}$/), region: null });
    request.flush({ message: signupAnswerMessage }, { status: 202, statusText: 'Accepted' });
    await settle(fixture);
    http.expectOne('/api/auth/me').flush({ user: { id: 3, email: form.email, name: form.name }, studios: [{ id: 9, name: 'Wickerby', role: 'owner' }] });
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith(['/studios', 9]);
  });

  it('when the server answers but nobody is signed in (the address has an account), then the answer is shown with ways to sign in', async () => {
    const { fill, submit, http, router, fixture, text } = await setUp();
    const navigate = jest.spyOn(router, 'navigate');
    await fill(form);
    await submit();
    http.expectOne('/api/auth/signup').flush({ message: signupAnswerMessage }, { status: 202, statusText: 'Accepted' });
    await settle(fixture);
    http.expectOne('/api/auth/me').flush({ error: { code: 'unauthenticated', message: 'Sign in first' } }, { status: 401, statusText: 'Unauthorized' });
    await settle(fixture);
    expect(navigate).not.toHaveBeenCalled();
    expect(text()).toContain(signupAnswerMessage);
    expect(text()).toContain('Forgot password?');
    expect((fixture.nativeElement as HTMLElement).querySelector('form')?.hidden).toBe(true);
  });

  it('when the server finds the password too easy to guess, then its reason shows under the password field', async () => {
    const { fill, submit, http, fields, fixture } = await setUp();
    await fill({ ...form, password: 'password12' });
    await submit();
    const reason = 'This password is too easy to guess. This is a commonly used password. Add more words that are less common.';
    http
      .expectOne('/api/auth/signup')
      .flush({ error: { code: 'weak_password', message: `password: ${reason}`, issues: [{ path: ['password'], message: reason }] } }, { status: 400, statusText: 'Bad Request' });
    await settle(fixture);
    const [, , password] = await fields();
    expect(await password.getTextErrors()).toEqual([reason]);
  });

  it('when a name holds a text-direction override, then the shared check refuses it before anything is sent', async () => {
    const { fill, submit, http, fields, fixture } = await setUp();
    await fill({ ...form, studioName: 'Wicker\u202Eby' });
    await submit();
    await fixture.whenStable();
    const [, , , studioName] = await fields();
    expect(await studioName.getTextErrors()).toEqual(['Studio name contains a control or text-direction character']);
    http.expectNone('/api/auth/signup');
  });
});
