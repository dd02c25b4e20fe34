import { useState, type FormEvent } from 'react';
import { Button, Field, Input, makeStyles, Spinner, tokens } from '@fluentui/react-components';
import type { OrganisationDto } from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { authKeys } from '@/features/auth/api/auth.queries';
import {
  noticeWindowQuery,
  organisationKeys,
  organisationQuery,
  updateOrganisation,
} from '@/features/organisation/api/organisation.queries';
import { NoticeWindowForm } from '@/features/organisation/components/NoticeWindowForm';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { PageHeader } from '@/ui/PageHeader';
import { session } from '@/api/session';

const useStyles = makeStyles({
  panel: {
    maxWidth: '36rem',
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalL,
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusLarge,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalXL,
  },
  actions: { display: 'flex', justifyContent: 'flex-end' },
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXL },
});

function OrganisationForm({ organisation }: { organisation: OrganisationDto }) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [name, setName] = useState(organisation.name);
  const mutation = useMutation({
    mutationFn: () => updateOrganisation({ name: name.trim() }),
    onSuccess: async (saved) => {
      queryClient.setQueryData(organisationKeys.all, saved);
      const user = session.getState().user;
      if (user) session.userChanged({ ...user, organisation: saved });
      await queryClient.invalidateQueries({ queryKey: authKeys.all });
      notify('Organisation name saved');
    },
  });
  const errors = formErrors(mutation.error, ['name'] as const);
  const localError = name.trim() ? undefined : 'The organisation needs a name.';
  const [touched, setTouched] = useState(false);
  const nameError = (touched ? localError : undefined) ?? errors.fields.name;

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    setTouched(true);
    if (localError) return;
    mutation.mutate();
  };

  return (
    <form className={styles.panel} onSubmit={handleSubmit} noValidate aria-label="Organisation details">
      <ErrorBanner messages={errors.general} />
      <Field
        label="Organisation name"
        required
        hint="Shown in the header and in every e-mail Rotaplex sends."
        validationMessage={nameError}
        validationState={nameError ? 'error' : 'none'}
      >
        <Input value={name} maxLength={160} onChange={(_, d) => setName(d.value)} />
      </Field>
      <div className={styles.actions}>
        <Button
          type="submit"
          appearance="primary"
          disabled={mutation.isPending || name.trim() === organisation.name}
          icon={mutation.isPending ? <Spinner size="tiny" /> : undefined}
        >
          Save
        </Button>
      </div>
    </form>
  );
}

export function OrganisationPage() {
  const styles = useStyles();
  const organisation = useQuery(organisationQuery());
  const noticeWindow = useQuery(noticeWindowQuery());
  return (
    <div className={styles.stack}>
      <PageHeader title="Organisation" description="The organisation everyone in Rotaplex belongs to." />
      {organisation.isPending && <LoadingState label="Loading organisation" />}
      {organisation.isError && (
        <ErrorBanner error={organisation.error} onRetry={() => void organisation.refetch()} />
      )}
      {organisation.data && <OrganisationForm key={organisation.data.id} organisation={organisation.data} />}
      {noticeWindow.isError && (
        <ErrorBanner error={noticeWindow.error} onRetry={() => void noticeWindow.refetch()} />
      )}
      {noticeWindow.data && <NoticeWindowForm settings={noticeWindow.data} />}
    </div>
  );
}
