import { Field, Input } from '@fluentui/react-components';
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from '@rotaplex/contracts';

export interface PasswordFieldsProps {
  password: string;
  confirmation: string;
  onPasswordChange: (value: string) => void;
  onConfirmationChange: (value: string) => void;
  /** Error from the server or from the length check, shown under the new password. */
  passwordError?: string;
  confirmationError?: string;
  label?: string;
}

/** New password plus confirmation, with the length rule stated up front. */
export function PasswordFields(props: PasswordFieldsProps) {
  const { password, confirmation, passwordError, confirmationError, label = 'New password' } = props;
  return (
    <>
      <Field
        label={label}
        required
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A short sentence is easy to remember.`}
        validationMessage={passwordError}
        validationState={passwordError ? 'error' : 'none'}
      >
        <Input
          type="password"
          autoComplete="new-password"
          value={password}
          maxLength={PASSWORD_MAX_LENGTH}
          onChange={(_, data) => props.onPasswordChange(data.value)}
        />
      </Field>
      <Field
        label="Repeat the new password"
        required
        validationMessage={confirmationError}
        validationState={confirmationError ? 'error' : 'none'}
      >
        <Input
          type="password"
          autoComplete="new-password"
          value={confirmation}
          maxLength={PASSWORD_MAX_LENGTH}
          onChange={(_, data) => props.onConfirmationChange(data.value)}
        />
      </Field>
    </>
  );
}
