import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';

import { ApiError } from './api-error';
import { AppErrorHandler, describeError } from './app-error-handler';
import { ErrorSnack } from './error-snack';

describe('AppErrorHandler', () => {
  it('should describe an ApiError by its title and detail', () => {
    const error = new ApiError(409, 'Already invited.', 'An invitation for this address is waiting.');
    expect(describeError(error).message).toBe('Already invited. An invitation for this address is waiting.');
  });

  it('should list the fields the server refused', () => {
    const error = new ApiError(400, 'Some fields are not valid.', null, [{ field: 'name', message: 'is required' }]);
    expect(describeError(error).fields).toEqual([{ field: 'name', message: 'is required' }]);
  });

  it('should find an ApiError inside a rejected promise', () => {
    const rejection = { rejection: new ApiError(403, 'Your role does not allow this.') };
    expect(describeError(rejection).message).toBe('Your role does not allow this.');
  });

  it('should not show a programming error’s text to the person', () => {
    expect(describeError(new TypeError('x is undefined')).message).toBe('Something went wrong. Reload the page and try again.');
  });

  it('should open a snack bar with the description', async () => {
    TestBed.configureTestingModule({ providers: [AppErrorHandler] });
    const open = vi.spyOn(TestBed.inject(MatSnackBar), 'openFromComponent').mockReturnValue(undefined as never);
    vi.spyOn(console, 'error').mockImplementation(() => undefined);
    TestBed.inject(AppErrorHandler).handleError(new ApiError(429, 'Too many attempts.'));
    await vi.waitFor(() => expect(open).toHaveBeenCalledWith(ErrorSnack, expect.objectContaining({ data: { message: 'Too many attempts.', fields: [] } })));
  });
});
