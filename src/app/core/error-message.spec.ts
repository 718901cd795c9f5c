import { HttpErrorResponse } from '@angular/common/http';
import { FormControl, FormGroup } from '@angular/forms';
import { errorMessage, problemOf, showOnField, withoutFieldName } from './error-message';

const httpError = (status: number, error: unknown) => new HttpErrorResponse({ status, error });

describe('error messages', () => {
  it('uses the server message for refusals meant for people', () => {
    const p = problemOf(httpError(400, { error: { code: 'invalid', message: 'email: is not an e-mail address', field: 'email' } }));
    expect(p).toEqual({ status: 400, code: 'invalid', message: 'email: is not an e-mail address', field: 'email' });
    expect(errorMessage(httpError(429, { error: { code: 'rate-limited', message: 'Too many failed sign-ins; wait 15 minutes' } }))).toBe(
      'Too many failed sign-ins; wait 15 minutes',
    );
  });

  it('keeps its own words for 401, 403 and 404, and for server failures', () => {
    expect(errorMessage(httpError(403, { error: { code: 'forbidden', message: 'role editor' } }))).toBe('Your role in this workspace does not allow this.');
    expect(errorMessage(httpError(404, { error: { code: 'not-found', message: 'No such design 12' } }))).toBe('Not found, or not in a workspace of yours.');
    expect(errorMessage(httpError(500, { error: { code: 'internal', message: 'stack' } }))).toBe('Something went wrong on the server; nothing was changed.');
  });

  it('says when the server did not answer at all', () => {
    expect(errorMessage(httpError(0, null))).toMatch(/did not answer/);
  });

  it('puts a refusal that names a field beside that field, without repeating its name', () => {
    const form = new FormGroup({ password: new FormControl('') });
    const shown = showOnField(form, httpError(400, { error: { code: 'invalid', message: 'password must be at least 8 characters', field: 'password' } }));
    expect(shown).toBe(true);
    expect(form.controls.password.getError('server')).toBe('Must be at least 8 characters');
    expect(showOnField(form, httpError(400, { error: { code: 'invalid', message: 'x', field: 'other' } }))).toBe(false);
    expect(withoutFieldName('The current password is wrong', 'currentPassword')).toBe('The current password is wrong');
  });
});
