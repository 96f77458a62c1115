import { HttpErrorResponse } from '@angular/common/http';
import { apiErrorMessage } from './api-error-message';

function answer(status: number, error: unknown, statusText = ''): HttpErrorResponse {
  return new HttpErrorResponse({ status, statusText, error, url: '/api/v1/x' });
}

describe('apiErrorMessage', () => {
  it("uses the server's message from the error shape of API.md", () => {
    const failure = answer(401, { error: { code: 'unauthorized', message: 'The e-mail address or password is not right.' } });
    expect(apiErrorMessage(failure)).toBe('The e-mail address or password is not right.');
  });

  it('adds details that name a field, unless the message already says them', () => {
    const failure = answer(400, {
      error: {
        code: 'invalid',
        message: 'The request is not valid.',
        details: [
          { path: 'email', message: 'is not an e-mail address' },
          { path: 'role', message: 'must be one of owner, analyst, thermal, viewer' },
        ],
      },
    });
    expect(apiErrorMessage(failure)).toBe(
      'The request is not valid. (email: is not an e-mail address; role: must be one of owner, analyst, thermal, viewer)',
    );
    const repeated = answer(409, {
      error: { code: 'conflict', message: 'role: the last owner cannot leave', details: [{ path: 'role', message: 'the last owner cannot leave' }] },
    });
    expect(apiErrorMessage(repeated)).toBe('role: the last owner cannot leave');
  });

  it('names the row and column of an upload error', () => {
    const failure = answer(400, {
      error: { code: 'invalid-file', message: 'The file was refused.', details: [{ row: 3, column: 'x', message: 'is not a number' }] },
    });
    expect(apiErrorMessage(failure)).toBe('The file was refused. (row 3, x: is not a number)');
  });

  it('says the server cannot be reached when there is no answer at all', () => {
    expect(apiErrorMessage(answer(0, new ProgressEvent('error')))).toMatch(/cannot be reached/);
  });

  it('falls back to the status when the body is not the error shape (e.g. a proxy page)', () => {
    expect(apiErrorMessage(answer(502, '<html>Bad gateway</html>', 'Bad Gateway'))).toBe(
      'The server answered 502 Bad Gateway without an explanation.',
    );
  });
});
