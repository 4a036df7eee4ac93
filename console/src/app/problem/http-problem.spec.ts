import { HttpErrorResponse } from '@angular/common/http';
import { errorMessage, toProblem } from './http-problem';

describe('toProblem', () => {
  it('reads an HTTP problem document with its field errors', () => {
    const error = new HttpErrorResponse({
      status: 422,
      error: {
        title: 'Unprocessable',
        detail: 'One value cannot be used.',
        errors: [{ pointer: '/channels/0/delayMs', message: 'must be at most 100' }],
        requestId: 'req_1',
      },
    });
    expect(toProblem(error)).toEqual({
      status: 422,
      title: 'Unprocessable',
      detail: 'One value cannot be used.',
      fieldErrors: [{ pointer: '/channels/0/delayMs', message: 'must be at most 100' }],
      requestId: 'req_1',
    });
  });

  it('reads a thrown error as status 0 with its message, and anything else as a generic failure', () => {
    expect(toProblem(new Error('socket closed'))).toEqual({
      status: 0,
      title: 'Something went wrong',
      detail: 'socket closed',
      fieldErrors: [],
    });
    expect(toProblem('weird').detail).toBe('Something went wrong.');
  });
});

describe('errorMessage', () => {
  it('gives one line with the title, detail and fields', () => {
    const error = new HttpErrorResponse({
      status: 400,
      error: { title: 'Bad request', errors: [{ pointer: '/name', message: 'is required' }] },
    });
    expect(errorMessage(error)).toBe('Bad request (/name: is required)');
  });

  it('names the status in plain words when the body is an HTML page', () => {
    const error = new HttpErrorResponse({ status: 502, error: '<html>Bad gateway</html>' });
    expect(errorMessage(error)).toBe('The server is not answering');
  });
});
