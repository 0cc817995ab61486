import { HttpErrorResponse } from '@angular/common/http';
import { FormControl, FormGroup, Validators } from '@angular/forms';
import { applyFieldErrors, describeApiError } from './api-error';

describe('describeApiError', () => {
  it('when the body is an ApiErrorBody, then takes its message and per-field details by top-level field', () => {
    const err = new HttpErrorResponse({
      status: 400,
      error: {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          details: [
            { field: 'tags.2', message: 'Use lower-case letters.' },
            { field: 'timeZone', message: 'Unknown time zone.' },
          ],
        },
      },
    });

    expect(describeApiError(err)).toEqual({
      status: 400,
      code: 'validation_failed',
      message: 'Some fields need attention.',
      fields: { tags: 'Use lower-case letters.', timeZone: 'Unknown time zone.' },
    });
  });

  it('when the server cannot be reached, then says so instead of a blank message', () => {
    const problem = describeApiError(new HttpErrorResponse({ status: 0, error: new ProgressEvent('error') }));
    expect(problem.message).toContain('cannot be reached');
  });

  it('when a proxy answers 502 with HTML, then gives a readable sentence', () => {
    const problem = describeApiError(new HttpErrorResponse({ status: 502, error: '<html>Bad gateway</html>' }));
    expect(problem.message).toBe('The server ran into a problem. Please try again in a moment.');
  });
});

describe('applyFieldErrors', () => {
  it('when a field matches a control, then marks it; otherwise returns it for the general message', () => {
    const form = new FormGroup({ name: new FormControl('Cottonwood', Validators.required) });

    const unmatched = applyFieldErrors(form, { name: 'Already used.', owner: 'Not allowed.' });

    expect(form.controls.name.getError('server')).toBe('Already used.');
    expect(form.controls.name.touched).toBe(true);
    expect(unmatched).toEqual(['owner: Not allowed.']);
  });
});
