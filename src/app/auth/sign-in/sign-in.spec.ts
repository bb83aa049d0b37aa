import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter, Router } from '@angular/router';
import { SignIn } from './sign-in';

async function setUp() {
  TestBed.configureTestingModule({
    imports: [SignIn],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([{ path: '**', children: [] }])],
  });
  document.cookie = 'XSRF-TOKEN=test-token';
  const fixture = TestBed.createComponent(SignIn);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  await fixture.whenStable();
  return {
    fixture,
    http: TestBed.inject(HttpTestingController),
    router: TestBed.inject(Router),
    email: await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=email]' })),
    password: await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=password]' })),
    submit: await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' })),
    fields: () => loader.getAllHarnesses(MatFormFieldHarness),
  };
}

describe('SignIn', () => {
  it('when submitted empty, then each field shows the shared schema message and nothing is sent', async () => {
    const { submit, fields, http, fixture } = await setUp();
    await submit.click();
    await fixture.whenStable();
    const [email, password] = await fields();
    expect(await email.getTextErrors()).toEqual(['Enter a valid e-mail address']);
    expect(await password.getTextErrors()).toEqual(['Enter your password']);
    http.expectNone('/api/auth/login');
  });

  it('when the server accepts, then it posts the form and goes to the first studio', async () => {
    const { email, password, submit, http, router, fixture } = await setUp();
    const navigate = jest.spyOn(router, 'navigateByUrl');
    await email.setValue('owner@demo.test');
    await password.setValue('kerfcast-demo');
    await submit.click();
    const request = http.expectOne('/api/auth/login');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'owner@demo.test', password: 'kerfcast-demo' });
    request.flush({ user: { id: 1, email: 'owner@demo.test', name: 'Owner' }, studios: [{ id: 7, name: 'Demo', role: 'owner' }] });
    await fixture.whenStable();
    await new Promise((resolve) => setTimeout(resolve));
    expect(navigate).toHaveBeenCalledWith('/studios/7');
  });

  it('when the server says the password is wrong, then the message lands on the password field', async () => {
    const { email, password, submit, http, fields, fixture } = await setUp();
    await email.setValue('owner@demo.test');
    await password.setValue('nope-nope-nope');
    await submit.click();
    http
      .expectOne('/api/auth/login')
      .flush(
        { error: { code: 'bad_credentials', message: 'Wrong e-mail or password', issues: [{ path: ['password'], message: 'Wrong e-mail or password' }] } },
        { status: 401, statusText: 'Unauthorized' },
      );
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
    const [, passwordField] = await fields();
    expect(await passwordField.getTextErrors()).toEqual(['Wrong e-mail or password']);
  });
});
