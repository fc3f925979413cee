import { HttpErrorResponse, HttpHeaders } from '@angular/common/http';
import { toApiFailure } from './api-failure';

describe('toApiFailure', () => {
  it("keeps the server's code, sentence and field messages", () => {
    const failure = toApiFailure(
      new HttpErrorResponse({
        status: 400,
        error: { error: { code: 'invalid_body', message: 'Check the form.', fields: { email: 'Enter a valid e-mail address.' } } },
      }),
    );
    expect(failure).toMatchObject({ status: 400, code: 'invalid_body', message: 'Check the form.' });
    expect(failure.fields).toEqual({ email: 'Enter a valid e-mail address.' });
  });

  it('reads how long to wait from Retry-After', () => {
    const failure = toApiFailure(
      new HttpErrorResponse({
        status: 429,
        headers: new HttpHeaders({ 'Retry-After': '90' }),
        error: { error: { code: 'too_many_requests', message: 'Slow down.' } },
      }),
    );
    expect(failure.retryAfterSeconds).toBe(90);
  });

  it('explains an unreachable server in our own words', () => {
    expect(toApiFailure(new HttpErrorResponse({ status: 0 })).code).toBe('unreachable');
  });

  it('does not trust an error body outside the agreed shape', () => {
    const failure = toApiFailure(new HttpErrorResponse({ status: 502, error: '<html>Bad gateway</html>' }));
    expect(failure.code).toBe('unexpected');
    expect(failure.message).toContain('HTTP 502');
  });
});
