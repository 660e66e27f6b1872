import { HttpErrorResponse } from '@angular/common/http';
import { UNREACHABLE_MESSAGE, describeApiError } from './api-error';

describe('describeApiError', () => {
  it('uses the server message and field errors when the body has the API error shape', () => {
    const problem = describeApiError(
      new HttpErrorResponse({
        status: 400,
        error: {
          error: {
            code: 'invalid',
            message: 'Check the highlighted fields',
            fields: [{ field: 'email', message: 'Not a valid e-mail address' }],
          },
        },
      }),
    );
    expect(problem).toEqual({
      message: 'Check the highlighted fields',
      unreachable: false,
      code: 'invalid',
      fields: { email: 'Not a valid e-mail address' },
    });
  });

  it('says the server cannot be reached when there was no answer', () => {
    const problem = describeApiError(new HttpErrorResponse({ status: 0, error: new ProgressEvent('error') }));
    expect(problem.unreachable).toBeTrue();
    expect(problem.message).toBe(UNREACHABLE_MESSAGE);
  });

  it('words a rate limit without a body and a server fault with its status', () => {
    expect(describeApiError(new HttpErrorResponse({ status: 429, error: 'Too Many Requests' })).message).toContain('Wait a minute');
    expect(describeApiError(new HttpErrorResponse({ status: 502, error: '<html>' })).message).toContain('HTTP 502');
  });
});
