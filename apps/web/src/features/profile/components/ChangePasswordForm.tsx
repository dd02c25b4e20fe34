import { useState, type FormEvent } from 'react';
import { Button, Field, Input, makeStyles, Spinner, tokens } from '@fluentui/react-components';
import { useMutation } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { changePassword } from '@/features/auth/api/auth.queries';
import { PasswordFields } from '@/features/auth/components/PasswordFields';
import { checkNewPassword, type NewPasswordErrors } from '@/features/auth/passwordRules';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  actions: { display: 'flex', justifyContent: 'flex-end' },
});

export function ChangePasswordForm() {
  const styles = useStyles();
  const notify = useNotify();
  const [current, setCurrent] = useState('');
  const [password, setPassword] = useState('');
  const [confirmation, setConfirmation] = useState('');
  const [localErrors, setLocalErrors] = useState<NewPasswordErrors & { current?: string }>({});

  const mutation = useMutation({
    mutationFn: () => changePassword({ currentPassword: current, newPassword: password }),
    onSuccess: () => {
      setCurrent('');
      setPassword('');
      setConfirmation('');
      notify('Password changed');
    },
  });
  const server = formErrors(mutation.error, ['currentPassword', 'newPassword'] as const);

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const errors: NewPasswordErrors & { current?: string } = checkNewPassword(password, confirmation);
    if (!current) errors.current = 'Enter your current password.';
    setLocalErrors(errors);
    if (errors.current || errors.password || errors.confirmation) return;
    mutation.mutate();
  };

  const currentError = localErrors.current ?? server.fields.currentPassword;
  return (
    <form className={styles.form} onSubmit={handleSubmit} noValidate aria-label="Change password">
      <ErrorBanner messages={server.general} />
      <Field
        label="Current password"
        required
        validationMessage={currentError}
        validationState={currentError ? 'error' : 'none'}
      >
        <Input
          type="password"
          autoComplete="current-password"
          value={current}
          onChange={(_, d) => setCurrent(d.value)}
        />
      </Field>
      <PasswordFields
        password={password}
        confirmation={confirmation}
        onPasswordChange={setPassword}
        onConfirmationChange={setConfirmation}
        passwordError={localErrors.password ?? server.fields.newPassword}
        confirmationError={localErrors.confirmation}
      />
      <div className={styles.actions}>
        <Button
          type="submit"
          appearance="primary"
          disabled={mutation.isPending}
          icon={mutation.isPending ? <Spinner size="tiny" /> : undefined}
        >
          Change password
        </Button>
      </div>
    </form>
  );
}
