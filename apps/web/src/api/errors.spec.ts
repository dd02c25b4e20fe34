import { IsEmail, IsNotEmpty, IsUUID, MinLength, validate, type ValidationError } from 'class-validator';
import { ApiRequestError, formErrors, isForbidden, splitMessages, toApiError } from './errors';

/**
 * The messages come from the real class-validator (the library the API validates with) rather
 * than from strings typed here, so a change in its wording that breaks the field mapping fails
 * this test. NestJS's ValidationPipe sends the constraint messages of each failed property as the
 * `message` array of a 400 (NestJS docs, "Validation"; flattening from memory of its source).
 */
class InviteBody {
  @IsEmail()
  email = 'not-an-address';

  @IsNotEmpty()
  displayName = '';

  @MinLength(8)
  newPassword = 'short';

  @IsUUID('all', { each: true })
  unitIds = ['x'];
}

function flatten(errors: ValidationError[]): string[] {
  return errors.flatMap((e) => Object.values(e.constraints ?? {}));
}

describe('field messages from the API', () => {
  it('puts each class-validator message beside the field it names', async () => {
    const messages = flatten(await validate(new InviteBody()));
    expect(messages.length).toBe(4);
    const split = splitMessages(messages, ['email', 'displayName', 'newPassword', 'unitIds', 'new'] as const);
    expect(split.general).toEqual([]);
    expect(split.fields.email).toBe('Must be an email');
    expect(split.fields.displayName).toBe('Should not be empty');
    // "newPassword" is claimed by its own field, not by the shorter "new".
    expect(split.fields.newPassword).toBe('Must be longer than or equal to 8 characters');
    expect(split.fields.new).toBeUndefined();
    expect(split.fields.unitIds).toBe('Each value must be a UUID');
  });

  it('keeps messages that name no field of the form for the banner', () => {
    const split = splitMessages(['Invalid email or password', 'email must be an email'], [
      'email',
      'password',
    ] as const);
    expect(split.fields.email).toBe('Must be an email');
    expect(split.general).toEqual(['Invalid email or password']);
    // Nested paths as the pipe reports them for arrays of objects ("unitIds.0 must be ...").
    expect(splitMessages(['unitIds.0 must be a UUID'], ['unitIds'] as const).fields.unitIds).toBe(
      'Must be a UUID',
    );
  });

  it('reads the ApiError shape of a NestJS error response', () => {
    // NestJS docs ("Exception filters"): the built-in filter answers {statusCode, message, error}.
    const body = toApiError(409, 'Conflict', {
      statusCode: 409,
      message: 'A unit with this name exists',
      error: 'Conflict',
    });
    const error = new ApiRequestError(body);
    expect(error.status).toBe(409);
    expect(error.messages).toEqual(['A unit with this name exists']);
    expect(formErrors(error, ['name'] as const).general).toEqual(['A unit with this name exists']);
  });

  it('turns a body that is not an ApiError into a readable message', () => {
    const fromProxy = toApiError(502, 'Bad Gateway', '<html>bad gateway</html>');
    expect(fromProxy.statusCode).toBe(502);
    expect(fromProxy.message).toMatch(/server could not complete/);
    expect(toApiError(404, 'Not Found', undefined).message).toBe('The request failed (404 Not Found).');
  });
});

describe('isForbidden', () => {
  it('is true only for a 403 from the API, which a retry cannot change', () => {
    const refusal = (statusCode: number) =>
      new ApiRequestError({ statusCode, error: 'x', message: 'Your role (staff) may not do this' });
    expect(isForbidden(refusal(403))).toBe(true);
    expect(isForbidden(refusal(401))).toBe(false);
    expect(isForbidden(refusal(500))).toBe(false);
    expect(isForbidden(new Error('Failed to fetch'))).toBe(false);
    expect(isForbidden(undefined)).toBe(false);
  });
});
