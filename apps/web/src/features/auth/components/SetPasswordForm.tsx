import { useState, type FormEvent } from 'react';
import { Button, makeStyles, Spinner, tokens } from '@fluentui/react-components';
import { useMutation } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { checkNewPassword, type NewPasswordErrors } from '@/features/auth/passwordRules';
import { PasswordFields } from './PasswordFields';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  actions: { display: 'flex', justifyContent: 'flex-end' },
});

export interface SetPasswordFormProps {
  token: string;
  submitLabel: string;
  onSubmit: (body: { token: string; password: string }) => Promise<void>;
  onDone: () => void;
}

/** Sets a password with a single-use token from an e-mail (invitation or reset). */
export function SetPasswordForm({ token, submitLabel, onSubmit, onDone }: SetPasswordFormProps) {
  const styles = useStyles();
  const [password, setPassword] = useState('');
  const [confirmation, setConfirmation] = useState('');
  const [localErrors, setLocalErrors] = useState<NewPasswordErrors>({});
  const mutation = useMutation({ mutationFn: onSubmit, onSuccess: onDone });
  const server = formErrors(mutation.error, ['password', 'token'] as const);

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const errors = checkNewPassword(password, confirmation);
    setLocalErrors(errors);
    if (errors.password || errors.confirmation) return;
    mutation.mutate({ token, password });
  };

  const general = [...server.general, ...(server.fields.token ? [server.fields.token] : [])];
  return (
    <form className={styles.form} onSubmit={handleSubmit} noValidate aria-label={submitLabel}>
      <ErrorBanner messages={general} title={general.length ? 'The link could not be used' : undefined} />
      <PasswordFields
        password={password}
        confirmation={confirmation}
        onPasswordChange={setPassword}
        onConfirmationChange={setConfirmation}
        passwordError={localErrors.password ?? server.fields.password}
        confirmationError={localErrors.confirmation}
      />
      <div className={styles.actions}>
        <Button
          type="submit"
          appearance="primary"
          disabled={mutation.isPending}
          icon={mutation.isPending ? <Spinner size="tiny" /> : undefined}
        >
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
