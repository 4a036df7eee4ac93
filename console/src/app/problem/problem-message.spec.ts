import { problemSummary, readProblem } from './problem-message';

describe('readProblem', () => {
  it('uses the title, detail, field errors and request id of an RFC 9457 document', () => {
    const problem = readProblem(400, {
      type: 'https://isochron.example/problems/validation',
      title: 'Invalid request',
      status: 400,
      detail: 'Two fields are invalid.',
      requestId: 'req_42',
      errors: [
        { pointer: '/filters/0/frequencyHz', message: 'must be < 24000' },
        { pointer: '/sampleRateHz', message: 'must be integer' },
      ],
    });
    expect(problem).toEqual({
      status: 400,
      title: 'Invalid request',
      detail: 'Two fields are invalid.',
      requestId: 'req_42',
      fieldErrors: [
        { pointer: '/filters/0/frequencyHz', message: 'must be < 24000' },
        { pointer: '/sampleRateHz', message: 'must be integer' },
      ],
    });
  });

  it('parses a problem document that arrives as text', () => {
    const problem = readProblem(403, '{"title":"Forbidden","status":403,"detail":"Needs the admin role."}');
    expect(problem.title).toBe('Forbidden');
    expect(problem.detail).toBe('Needs the admin role.');
  });

  it('falls back to a plain title for an HTML or empty body and never echoes the HTML', () => {
    const problem = readProblem(502, '<html><body>Bad gateway</body></html>');
    expect(problem.title).toBe('The server is not answering');
    expect(problemSummary(problem)).not.toContain('<');
    expect(readProblem(0, null).title).toBe('The server could not be reached');
    expect(readProblem(418, undefined).title).toBe('The request failed (HTTP 418)');
    expect(readProblem(507, {}).title).toBe('The server failed to handle the request');
  });

  it('drops a detail that repeats the title and tolerates malformed error entries', () => {
    const problem = readProblem(422, { title: 'Same', detail: 'Same', errors: [{ pointer: 5 }, 'x', null] });
    expect(problem.detail).toBeUndefined();
    expect(problem.fieldErrors).toEqual([{ pointer: '', message: 'is invalid' }]);
  });
});

describe('problemSummary', () => {
  it('joins title, detail and every field error into one sentence', () => {
    const text = problemSummary({
      status: 422,
      title: 'A value cannot be used',
      detail: 'Frequency at or above Nyquist.',
      fieldErrors: [
        { pointer: '/frequencyHz', message: 'must be below 24000 Hz' },
        { pointer: '', message: 'x' },
      ],
    });
    expect(text).toBe(
      'A value cannot be used — Frequency at or above Nyquist. (/frequencyHz: must be below 24000 Hz; x)',
    );
  });
});
