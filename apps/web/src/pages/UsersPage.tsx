import { useEffect, useRef, useState } from 'react';
import { Button, makeStyles, SearchBox, tokens } from '@fluentui/react-components';
import { PeopleTeamRegular, PersonAddRegular } from '@fluentui/react-icons';
import type { UserDto } from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useNavigation, useSearchParams } from 'react-router-dom';
import { useCan, useCurrentUser } from '@/features/auth/hooks/useCurrentUser';
import { unitsQuery } from '@/features/units/api/units.queries';
import {
  deactivateUser,
  reactivateUser,
  resendInvitation,
  userKeys,
  usersListQuery,
} from '@/features/users/api/users.queries';
import type { UserAction } from '@/features/users/components/UserActionsMenu';
import { UserFormDialog } from '@/features/users/components/UserFormDialog';
import { UsersTable } from '@/features/users/components/UsersTable';
import {
  readUsersListParams,
  USER_PAGE_SIZES,
  writeUsersListParams,
  type UserSortField,
  type UsersListParams,
} from '@/features/users/usersListParams';
import { useDebouncedValue } from '@/hooks/useDebouncedValue';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { PageHeader } from '@/ui/PageHeader';
import { Pagination } from '@/ui/Pagination';

const useStyles = makeStyles({
  toolbar: {
    display: 'flex',
    gap: tokens.spacingHorizontalM,
    marginBottom: tokens.spacingVerticalM,
    flexWrap: 'wrap',
  },
  search: { flexGrow: 1, maxWidth: '28rem' },
  panel: {
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusLarge,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalL,
  },
});

type Pending = { action: 'deactivate' | 'reactivate'; user: UserDto } | null;

export function UsersPage() {
  const styles = useStyles();
  const me = useCurrentUser();
  const canWrite = useCan('users:write');
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [searchParams, setSearchParams] = useSearchParams();
  const params = readUsersListParams(searchParams);
  const [search, setSearch] = useState(params.q);
  const debouncedSearch = useDebouncedValue(search.trim());

  const users = useQuery(usersListQuery(params));
  const units = useQuery(unitsQuery());
  const [editing, setEditing] = useState<UserDto | 'new' | null>(null);
  const [pending, setPending] = useState<Pending>(null);

  const update = (changes: Partial<UsersListParams>) =>
    setSearchParams(writeUsersListParams({ ...params, ...changes }), { replace: true });

  // A search that settles while the person is already leaving the page must not pull them back.
  const navigation = useNavigation();
  const leaving = useRef(false);
  useEffect(() => {
    leaving.current = navigation.state !== 'idle';
  }, [navigation.state]);

  useEffect(() => {
    if (!leaving.current && debouncedSearch !== params.q) update({ q: debouncedSearch, page: 1 });
    // Only a settled search term should rewrite the address.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [debouncedSearch]);

  const handleSort = (field: UserSortField) =>
    update({ sort: field, order: params.sort === field && params.order === 'asc' ? 'desc' : 'asc', page: 1 });

  const statusChange = useMutation({
    mutationFn: ({ action, user }: NonNullable<Pending>) =>
      action === 'deactivate' ? deactivateUser(user.id) : reactivateUser(user.id),
    onSuccess: async (user, { action }) => {
      await queryClient.invalidateQueries({ queryKey: userKeys.all });
      notify(
        action === 'deactivate'
          ? `${user.displayName} can no longer sign in`
          : `${user.displayName} is active again`,
      );
      setPending(null);
    },
  });

  const resend = useMutation({
    mutationFn: (user: UserDto) => resendInvitation(user.id),
    onSuccess: (_, user) => notify(`A new invitation is on its way to ${user.email}`),
    onError: (error) => notify(error.message, 'error'),
  });

  const handleAction = (action: UserAction, user: UserDto) => {
    if (action === 'edit') setEditing(user);
    else if (action === 'resend') resend.mutate(user);
    else {
      statusChange.reset();
      setPending({ action, user });
    }
  };

  const list = users.data;
  return (
    <>
      <PageHeader
        title="People"
        description={
          canWrite
            ? 'Everyone who can sign in to your organisation. Invite colleagues and set what they can do.'
            : 'The people in the units you manage.'
        }
        actions={
          canWrite && (
            <Button appearance="primary" icon={<PersonAddRegular />} onClick={() => setEditing('new')}>
              Invite person
            </Button>
          )
        }
      />
      <section className={styles.panel} aria-label="People list">
        <div className={styles.toolbar} role="search">
          <SearchBox
            className={styles.search}
            aria-label="Search people by name or e-mail"
            placeholder="Search by name or e-mail"
            value={search}
            onChange={(_, d) => setSearch(d.value)}
          />
        </div>
        {users.isError && <ErrorBanner error={users.error} onRetry={() => void users.refetch()} />}
        {users.isPending && <TableSkeleton label="Loading people" />}
        {list && list.items.length === 0 && (
          <EmptyState
            icon={<PeopleTeamRegular />}
            title={params.q ? 'No one matches your search' : 'No people yet'}
          >
            {params.q
              ? `Nobody's name or e-mail contains "${params.q}". Check the spelling or clear the search.`
              : 'Invite the first colleague to get started.'}
          </EmptyState>
        )}
        {list && list.items.length > 0 && (
          <>
            <UsersTable
              users={list.items}
              units={units.data ?? []}
              params={params}
              currentUserId={me.id}
              canWrite={canWrite}
              onSort={handleSort}
              onAction={handleAction}
            />
            <Pagination
              label="People"
              page={params.page}
              pageSize={params.pageSize}
              total={list.total}
              pageSizes={USER_PAGE_SIZES}
              onPageChange={(page) => update({ page })}
              onPageSizeChange={(pageSize) => update({ pageSize, page: 1 })}
            />
          </>
        )}
      </section>
      {editing && (
        <UserFormDialog
          key={editing === 'new' ? 'new' : editing.id}
          open
          user={editing === 'new' ? undefined : editing}
          units={units.data ?? []}
          onClose={() => setEditing(null)}
        />
      )}
      {pending && (
        <ConfirmDialog
          open
          title={
            pending.action === 'deactivate'
              ? `Deactivate ${pending.user.displayName}?`
              : `Reactivate ${pending.user.displayName}?`
          }
          confirmLabel={pending.action === 'deactivate' ? 'Deactivate' : 'Reactivate'}
          pending={statusChange.isPending}
          error={statusChange.error}
          onConfirm={() => statusChange.mutate(pending)}
          onCancel={() => setPending(null)}
        >
          {pending.action === 'deactivate'
            ? `${pending.user.displayName} will be signed out everywhere and cannot sign in until reactivated. Their history stays.`
            : `${pending.user.displayName} will be able to sign in again with their existing password.`}
        </ConfirmDialog>
      )}
    </>
  );
}
