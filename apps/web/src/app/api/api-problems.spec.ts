import { HttpErrorResponse } from '@angular/common/http';
import { FormControl, FormGroup } from '@angular/forms';
import { fieldProblemsOf, showProblems } from './api-problems';

function badRequest(problems: { path: string; message: string }[]): HttpErrorResponse {
  return new HttpErrorResponse({
    status: 400,
    error: { error: { code: 'validation_failed', message: 'Invalid body', details: { problems } } },
  });
}

describe('API field problems on a form', () => {
  const form = () =>
    new FormGroup({
      taxRate: new FormControl(''),
      numberPrefixes: new FormGroup({ job: new FormControl('') }),
    });

  it('puts each problem on the control it names, renamed where the form differs', () => {
    const f = form();
    const err = badRequest([
      { path: 'defaultTaxRateBp', message: 'Too big' },
      { path: 'numberPrefixes.job', message: 'letters, digits, "-" and "/" only' },
    ]);
    expect(showProblems(f, err, { defaultTaxRateBp: 'taxRate' })).toBeNull();
    expect(f.controls.taxRate.errors).toEqual({ server: 'Too big' });
    expect(f.get('numberPrefixes.job')?.errors).toEqual({
      server: 'letters, digits, "-" and "/" only',
    });
    expect(f.controls.taxRate.touched).toBe(true);
  });

  it('returns what no field can show, for the form as a whole', () => {
    const err = badRequest([{ path: 'unknownField', message: 'Not allowed' }]);
    expect(showProblems(form(), err)).toBe('Not allowed');
  });

  it('returns the API’s message for a refusal that is not about fields', () => {
    const err = new HttpErrorResponse({
      status: 409,
      error: { error: { code: 'conflict', message: 'a@b.test is already a member of this firm.' } },
    });
    expect(fieldProblemsOf(err)).toEqual([]);
    expect(showProblems(form(), err)).toBe('a@b.test is already a member of this firm.');
  });
});
