import { useState, type FormEvent } from 'react';
import {
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Spinner,
  tokens,
} from '@fluentui/react-components';
import { useMutation } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { PATHS } from '@/app/paths';
import { AppLink } from '@/ui/AppLink';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { signIn } from '@/features/auth/api/auth.queries';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  row: {
    display: 'flex',
    justifyContent: 'space-between',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
  },
});

export interface SignInFormProps {
  sessionEnded?: boolean;
  onSignedIn: () => void;
}

export function SignInForm({ sessionEnded, onSignedIn }: SignInFormProps) {
  const styles = useStyles();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const mutation = useMutation({ mutationFn: signIn, onSuccess: onSignedIn });
  const errors = formErrors(mutation.error, ['email', 'password'] as const);

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    mutation.mutate({ email: email.trim(), password });
  };

  return (
    <form className={styles.form} onSubmit={handleSubmit} noValidate aria-label="Sign in">
      {sessionEnded && !mutation.error && (
        <MessageBar intent="info">
          <MessageBarBody>Your session has ended. Please sign in again.</MessageBarBody>
        </MessageBar>
      )}
      <ErrorBanner messages={errors.general} />
      <Field
        label="E-mail address"
        required
        validationMessage={errors.fields.email}
        validationState={errors.fields.email ? 'error' : 'none'}
      >
        <Input
          type="email"
          autoComplete="username"
          value={email}
          onChange={(_, data) => setEmail(data.value)}
          autoFocus
        />
      </Field>
      <Field
        label="Password"
        required
        validationMessage={errors.fields.password}
        validationState={errors.fields.password ? 'error' : 'none'}
      >
        <Input
          type="password"
          autoComplete="current-password"
          value={password}
          onChange={(_, data) => setPassword(data.value)}
        />
      </Field>
      <div className={styles.row}>
        <AppLink to={PATHS.forgotPassword}>Forgot your password?</AppLink>
        <Button
          type="submit"
          appearance="primary"
          disabled={mutation.isPending}
          icon={mutation.isPending ? <Spinner size="tiny" /> : undefined}
        >
          Sign in
        </Button>
      </div>
    </form>
  );
}
