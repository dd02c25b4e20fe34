import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from '@rotaplex/contracts';

export interface NewPasswordErrors {
  password?: string;
  confirmation?: string;
}

/** Client-side checks that save a round trip; the server checks the same rules again. */
export function checkNewPassword(password: string, confirmation: string): NewPasswordErrors {
  const errors: NewPasswordErrors = {};
  if (password.length < PASSWORD_MIN_LENGTH)
    errors.password = `Use at least ${PASSWORD_MIN_LENGTH} characters.`;
  else if (password.length > PASSWORD_MAX_LENGTH)
    errors.password = `Use at most ${PASSWORD_MAX_LENGTH} characters.`;
  if (confirmation !== password) errors.confirmation = 'The two passwords are not the same.';
  return errors;
}
