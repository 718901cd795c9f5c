import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { SignIn, safeReturnPath } from './sign-in';

describe('SignIn', () => {
  async function setup(next?: string) {
    await TestBed.configureTestingModule({ imports: [SignIn], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] }).compileComponents();
    const fixture = TestBed.createComponent(SignIn);
    if (next) fixture.componentRef.setInput('next', next);
    fixture.detectChanges();
    await fixture.whenStable();
    const el: HTMLElement = fixture.nativeElement;
    const type = (selector: string, value: string) => {
      const input = el.querySelector<HTMLInputElement>(selector)!;
      input.value = value;
      input.dispatchEvent(new Event('input'));
      input.dispatchEvent(new Event('blur'));
    };
    const submit = async () => {
      el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
      fixture.detectChanges();
      await fixture.whenStable();
    };
    return { fixture, el, type, submit, http: TestBed.inject(HttpTestingController) };
  }

  it('says what is missing instead of sending an empty form', async () => {
    const { el, submit, http } = await setup();
    await submit();
    http.expectNone('/api/auth/sign-in');
    expect(el.textContent).toContain('Enter your e-mail address.');
    expect(el.textContent).toContain('Enter your password.');
  });

  it('signs in and goes back to where the person was going', async () => {
    const { type, submit, http } = await setup('/designs/4?tab=history');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    type('input[type=email]', 'jonas.lindqvist@example.test');
    type('input[type=password]', 'osmolane-demo');
    await submit();
    http.expectOne('/api/auth/sign-in').flush({ token: 't', user: { id: 2, email: 'jonas.lindqvist@example.test', name: 'Jonas Lindqvist' } });
    expect(navigate).toHaveBeenCalledWith('/designs/4?tab=history');
  });

  it('explains a refusal in plain words', async () => {
    const { fixture, el, type, submit, http } = await setup();
    type('input[type=email]', 'jonas.lindqvist@example.test');
    type('input[type=password]', 'wrong');
    await submit();
    http.expectOne('/api/auth/sign-in').flush({ error: { code: 'not-signed-in', message: 'The e-mail or the password is wrong' } }, { status: 401, statusText: 'Unauthorized' });
    fixture.detectChanges();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('The e-mail address or the password is wrong.');
  });

  it('only returns to paths inside the app', () => {
    expect(safeReturnPath('/designs/4')).toBe('/designs/4');
    expect(safeReturnPath('//evil.example')).toBeNull();
    expect(safeReturnPath('https://evil.example')).toBeNull();
    expect(safeReturnPath('/sign-in?next=/x')).toBeNull();
    expect(safeReturnPath(undefined)).toBeNull();
  });
});
