import { describe, expect, it } from 'vitest';
import { apiErrorFrom, fieldErrorsFromDetails } from './apiError';

describe('apiErrorFrom', () => {
  it('keeps the message and the details of the server’s error body', () => {
    const error = apiErrorFrom(
      400,
      JSON.stringify({
        statusCode: 400,
        message: 'Check the highlighted fields',
        details: [{ where: 'email', problem: 'Enter a valid e-mail address' }, { nonsense: true }],
        requestId: 'req-9',
      }),
    );
    expect(error.status).toBe(400);
    expect(error.message).toBe('Check the highlighted fields');
    expect(error.details).toEqual([{ where: 'email', problem: 'Enter a valid e-mail address' }]);
    expect(error.fieldErrors).toEqual({ email: 'Enter a valid e-mail address' });
    expect(error.requestId).toBe('req-9');
  });

  it.each([
    // Bodies that are not ours: a proxy page, nothing, a list of messages.
    [502, '<html>Bad gateway</html>', 'The server answered with an error (502).'],
    [413, '', 'The file is too large for the server to accept.'],
    [429, '', 'Too many attempts. Wait a minute and try again.'],
    [
      400,
      JSON.stringify({ message: ['name is required', 'role is unknown'] }),
      'name is required; role is unknown',
    ],
  ])('%i with body %j reads "%s"', (status, text, message) => {
    expect(apiErrorFrom(status, text).message).toBe(message);
  });
});

describe('fieldErrorsFromDetails', () => {
  it('keeps the first problem of each field', () => {
    expect(
      fieldErrorsFromDetails([
        { where: 'password', problem: 'Too short' },
        { where: 'password', problem: 'Too common' },
        { where: 'features[3]', problem: 'No geometry' },
      ]),
    ).toEqual({ password: 'Too short', 'features[3]': 'No geometry' });
  });
});
