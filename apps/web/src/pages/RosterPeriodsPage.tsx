import { useState } from 'react';
import {
  Badge,
  Button,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
} from '@fluentui/react-components';
import {
  AddRegular,
  ArchiveRegular,
  CalendarLtrRegular,
  DataBarVerticalRegular,
  DeleteRegular,
  EditRegular,
} from '@fluentui/react-icons';
import type { RosterPeriodDto, RosterPeriodStatus } from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import {
  archiveRosterPeriod,
  deleteRosterPeriod,
  planningKeys,
  rosterPeriodsQuery,
} from '@/features/planning/api/planning.queries';
import { usePlanningStyles } from '@/features/planning/components/planningStyles';
import { RosterPeriodFormDialog } from '@/features/planning/components/RosterPeriodFormDialog';
import { RowActions } from '@/features/planning/components/RowActions';
import { UnitPicker } from '@/features/planning/components/UnitPicker';
import { UnitScope } from '@/features/planning/components/UnitScope';
import { useSelectedUnit } from '@/features/planning/hooks/useSelectedUnit';
import { lastDay, publishDeadline, suggestedStart } from '@/features/planning/utils/periodDates';
import { PATHS } from '@/app/paths';
import { AppLink } from '@/ui/AppLink';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { PageHeader } from '@/ui/PageHeader';

const STATUS: Record<RosterPeriodStatus, { label: string; color: 'warning' | 'success' | 'informative' }> = {
  draft: { label: 'Draft', color: 'warning' },
  published: { label: 'Published', color: 'success' },
  archived: { label: 'Archived', color: 'informative' },
};

const dateFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});
const fmt = (d: string) => dateFormat.format(new Date(`${d}T00:00:00Z`));

type Pending = { action: 'archive' | 'delete'; period: RosterPeriodDto } | null;

export function RosterPeriodsPage() {
  const styles = usePlanningStyles();
  const selected = useSelectedUnit();
  const periods = useQuery(rosterPeriodsQuery(selected.unitId));
  const [editing, setEditing] = useState<RosterPeriodDto | 'new' | null>(null);
  const [pending, setPending] = useState<Pending>(null);
  const notify = useNotify();
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const change = useMutation({
    mutationFn: async ({ action, period }: NonNullable<Pending>): Promise<void> => {
      if (action === 'archive') await archiveRosterPeriod(period.id);
      else await deleteRosterPeriod(period.id);
    },
    onSuccess: async (_, { action, period }) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.rosterPeriods });
      notify(`${action === 'archive' ? 'Archived' : 'Deleted'} the period from ${fmt(period.startDate)}`);
      setPending(null);
    },
  });
  const list = [...(periods.data ?? [])].sort((a, b) => b.startDate.localeCompare(a.startDate));
  const today = new Date().toISOString().slice(0, 10);

  return (
    <>
      <PageHeader
        title="Roster periods"
        description="The stretches of days a roster covers. A draft can still be changed; a published period is fixed; an archived one is kept for the record."
        actions={
          selected.unit && (
            <Button appearance="primary" icon={<AddRegular />} onClick={() => setEditing('new')}>
              New period
            </Button>
          )
        }
      />
      <UnitScope selected={selected}>
        {(unit) => (
          <section className={styles.panel} aria-label="Roster periods">
            <div className={styles.toolbar}>
              <UnitPicker units={selected.units} value={unit.id} onChange={selected.setUnitId} />
            </div>
            {periods.isError && <ErrorBanner error={periods.error} onRetry={() => void periods.refetch()} />}
            {periods.isPending && <TableSkeleton label="Loading roster periods" />}
            {periods.data && list.length === 0 && (
              <EmptyState icon={<CalendarLtrRegular />} title={`${unit.name} has no roster periods yet`}>
                Create the first period, for example four weeks from next Monday.
              </EmptyState>
            )}
            {list.length > 0 && (
              <Table aria-label={`Roster periods of ${unit.name}`}>
                <TableHeader>
                  <TableRow>
                    <TableHeaderCell>From</TableHeaderCell>
                    <TableHeaderCell>To</TableHeaderCell>
                    <TableHeaderCell>Days</TableHeaderCell>
                    <TableHeaderCell>Status</TableHeaderCell>
                    <TableHeaderCell>Publish by ({unit.publishLeadDays} days’ notice)</TableHeaderCell>
                    <TableHeaderCell className={styles.actionsCol}>
                      <span className="visually-hidden">Actions</span>
                    </TableHeaderCell>
                  </TableRow>
                </TableHeader>
                <TableBody>
                  {list.map((p) => (
                    <TableRow key={p.id}>
                      <TableCell className={styles.nowrap}>
                        <AppLink to={PATHS.planningBoard(p.id)}>{fmt(p.startDate)}</AppLink>
                      </TableCell>
                      <TableCell className={styles.nowrap}>{fmt(lastDay(p))}</TableCell>
                      <TableCell>{p.days}</TableCell>
                      <TableCell>
                        <Badge appearance="tint" shape="rounded" color={STATUS[p.status].color}>
                          {STATUS[p.status].label}
                        </Badge>
                      </TableCell>
                      <TableCell className={styles.nowrap}>
                        <PublishBy period={p} leadDays={unit.publishLeadDays} today={today} />
                      </TableCell>
                      <TableCell>
                        <RowActions
                          name={`the period from ${fmt(p.startDate)}`}
                          actions={[
                            {
                              label: 'Reports',
                              icon: <DataBarVerticalRegular />,
                              onClick: () => navigate(PATHS.periodReports(p.id)),
                            },
                            {
                              label: 'Edit dates',
                              icon: <EditRegular />,
                              disabled: p.status !== 'draft',
                              onClick: () => setEditing(p),
                            },
                            {
                              label: 'Archive',
                              icon: <ArchiveRegular />,
                              disabled: p.status === 'archived',
                              onClick: () => {
                                change.reset();
                                setPending({ action: 'archive', period: p });
                              },
                            },
                            {
                              label: 'Delete',
                              icon: <DeleteRegular />,
                              disabled: p.status !== 'draft',
                              onClick: () => {
                                change.reset();
                                setPending({ action: 'delete', period: p });
                              },
                            },
                          ]}
                        />
                      </TableCell>
                    </TableRow>
                  ))}
                </TableBody>
              </Table>
            )}
          </section>
        )}
      </UnitScope>
      {editing && selected.unit && (
        <RosterPeriodFormDialog
          key={editing === 'new' ? 'new' : editing.id}
          unitId={selected.unit.id}
          unitName={selected.unit.name}
          period={editing === 'new' ? undefined : editing}
          suggestedStart={suggestedStart(periods.data ?? [], today)}
          onClose={() => setEditing(null)}
        />
      )}
      {pending && (
        <ConfirmDialog
          open
          title={
            pending.action === 'archive'
              ? `Archive the period from ${fmt(pending.period.startDate)}?`
              : `Delete the draft period from ${fmt(pending.period.startDate)}?`
          }
          confirmLabel={pending.action === 'archive' ? 'Archive' : 'Delete'}
          pending={change.isPending}
          error={change.error}
          onConfirm={() => change.mutate(pending)}
          onCancel={() => setPending(null)}
        >
          {pending.action === 'archive'
            ? 'An archived period is kept for the record and can no longer be changed or published.'
            : 'The draft and anything planned in it are deleted.'}
        </ConfirmDialog>
      )}
    </>
  );
}

/** When a period should be (or was) published, against the unit's lead time; a late draft is marked. */
function PublishBy({
  period,
  leadDays,
  today,
}: {
  period: RosterPeriodDto;
  leadDays: number;
  today: string;
}) {
  const due = publishDeadline(period, leadDays, today);
  if (period.status !== 'draft') {
    if (!period.publishedAt) return <>{fmt(due.publishBy)}</>;
    const published = period.publishedAt.slice(0, 10);
    return (
      <>
        {fmt(due.publishBy)}
        {published > due.publishBy ? (
          <>
            {' '}
            <Badge appearance="tint" color="warning">
              Published late
            </Badge>
          </>
        ) : null}
      </>
    );
  }
  return (
    <>
      {fmt(due.publishBy)}{' '}
      {due.late ? (
        <Badge appearance="filled" color="danger">
          {-due.daysLeft} {due.daysLeft === -1 ? 'day' : 'days'} late
        </Badge>
      ) : (
        <Badge appearance="tint" color="informative">
          {due.daysLeft} {due.daysLeft === 1 ? 'day' : 'days'} left
        </Badge>
      )}
    </>
  );
}
