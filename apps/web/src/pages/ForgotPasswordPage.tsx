import { useState, type FormEvent } from 'react';
import {
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  tokens,
} from '@fluentui/react-components';
import { useMutation } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { PATHS } from '@/app/paths';
import { requestPasswordReset } from '@/features/auth/api/auth.queries';
import { AuthLayout } from '@/features/auth/components/AuthLayout';
import { AppLink } from '@/ui/AppLink';
import { ErrorBanner } from '@/ui/ErrorBanner';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  row: {
    display: 'flex',
    justifyContent: 'space-between',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
  },
});

export function ForgotPasswordPage() {
  const styles = useStyles();
  const [email, setEmail] = useState('');
  const mutation = useMutation({ mutationFn: requestPasswordReset });
  const errors = formErrors(mutation.error, ['email'] as const);

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    mutation.mutate({ email: email.trim() });
  };

  return (
    <AuthLayout title="Reset your password" lead="We'll e-mail you a link to choose a new one.">
      {mutation.isSuccess ? (
        <div className={styles.form}>
          <MessageBar intent="success" layout="multiline" role="status">
            <MessageBarBody>
              <MessageBarTitle>Check your e-mail</MessageBarTitle>
              If {email.trim()} belongs to an active account, a reset link is on its way. The link works once
              and expires after an hour.
            </MessageBarBody>
          </MessageBar>
          <AppLink to={PATHS.signIn}>Back to sign-in</AppLink>
        </div>
      ) : (
        <form className={styles.form} onSubmit={handleSubmit} noValidate aria-label="Reset your password">
          <ErrorBanner messages={errors.general} />
          <Field
            label="E-mail address"
            required
            validationMessage={errors.fields.email}
            validationState={errors.fields.email ? 'error' : 'none'}
          >
            <Input
              type="email"
              autoComplete="email"
              value={email}
              onChange={(_, d) => setEmail(d.value)}
              autoFocus
            />
          </Field>
          <div className={styles.row}>
            <AppLink to={PATHS.signIn}>Back to sign-in</AppLink>
            <Button
              type="submit"
              appearance="primary"
              disabled={mutation.isPending}
              icon={mutation.isPending ? <Spinner size="tiny" /> : undefined}
            >
              Send reset link
            </Button>
          </div>
        </form>
      )}
    </AuthLayout>
  );
}
