import type { ReactNode } from 'react';
import { Badge, Body1, Caption1, makeStyles, Subtitle1, tokens } from '@fluentui/react-components';
import {
  CalendarLtrRegular,
  ChevronRightRegular,
  PeopleSwapRegular,
  PersonClockRegular,
  WarningRegular,
} from '@fluentui/react-icons';
import {
  MAX_PAGE_SIZE,
  type Page,
  PLANNING_ROUTES,
  PUBLISH_LEAD_DAYS_DEFAULT,
  RED_FLAG_CAUTION,
  RED_FLAG_SOURCE,
  type RosterPeriodDto,
} from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { useHref, useLinkClickHandler } from 'react-router-dom';
import { api } from '@/api/client';
import { PATHS } from '@/app/paths';
import { useCan } from '@/features/auth/hooks/useCurrentUser';
import { readAllPages } from '@/features/planning-board/api/board.queries';
import { todayIn } from '@/features/my-roster/utils/rosterEvents';
import { lastDay, publishDeadline } from '@/features/planning/utils/periodDates';
import { requestTableQuery } from '@/features/requests/api/requests.queries';
import { openShiftsQuery, swapsQuery } from '@/features/swaps/api/swaps.queries';
import { dayLabel } from '@/features/swaps/utils/swapText';
import { unitsQuery } from '@/features/units/api/units.queries';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useSurfaceStyles } from '@/ui/surfaceStyles';

const useStyles = makeStyles({
  list: { listStyleType: 'none', margin: 0, padding: 0, display: 'grid', gap: tokens.spacingVerticalS },
  item: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    padding: tokens.spacingHorizontalM,
    borderRadius: tokens.borderRadiusMedium,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    color: tokens.colorNeutralForeground1,
    textDecorationLine: 'none',
    ':hover': { backgroundColor: tokens.colorBrandBackground2 },
    ':focus-visible': { outline: `${tokens.strokeWidthThick} solid ${tokens.colorStrokeFocus2}` },
  },
  urgent: { borderLeft: `${tokens.strokeWidthThickest} solid ${tokens.colorPaletteRedBorder2}` },
  icon: { fontSize: tokens.fontSizeBase500, display: 'flex', flexShrink: 0 },
  text: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXXS,
    flexGrow: 1,
    minWidth: 0,
  },
  muted: { color: tokens.colorNeutralForeground3 },
  badge: { flexShrink: 0 },
});

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** One thing that waits, as a link to where it is done. */
export function WaitingItem(props: {
  to: string;
  icon: ReactNode;
  title: string;
  detail?: ReactNode;
  urgent?: boolean;
  badge?: string;
}) {
  const styles = useStyles();
  const href = useHref(props.to);
  const onClick = useLinkClickHandler<HTMLAnchorElement>(props.to);
  return (
    <li>
      <a className={`${styles.item} ${props.urgent ? styles.urgent : ''}`} href={href} onClick={onClick}>
        <span className={styles.icon} aria-hidden="true">
          {props.icon}
        </span>
        <span className={styles.text}>
          <Body1>
            <strong>{props.title}</strong>
          </Body1>
          {props.detail && <Caption1 className={styles.muted}>{props.detail}</Caption1>}
        </span>
        {props.badge && (
          <Badge appearance="filled" color="danger" className={styles.badge}>
            {props.badge}
          </Badge>
        )}
        <ChevronRightRegular aria-hidden="true" className={styles.badge} />
      </a>
    </li>
  );
}

/** Draft periods of every unit the caller plans, soonest first. */
const draftPeriodsQuery = () => ({
  queryKey: ['roster-periods', 'drafts'] as const,
  queryFn: ({ signal }: { signal: AbortSignal }) =>
    readAllPages((page) =>
      api.get<Page<RosterPeriodDto>>(
        PLANNING_ROUTES.rosterPeriods,
        { status: 'draft', page, pageSize: MAX_PAGE_SIZE },
        signal,
      ),
    ),
});

/**
 * What waits for a manager: swaps and claims to decide, leave to decide, draft periods to generate and
 * publish with their lead time, shifts below minimum on published rosters and open shifts unfilled.
 */
export function WaitingForYou() {
  const styles = useStyles();
  const surface = useSurfaceStyles();
  const canPlan = useCan('rosters:plan');
  const canApprove = useCan('requests:approve');
  const swaps = useQuery({ ...swapsQuery({ waitingForMe: true }), enabled: canApprove });
  const leave = useQuery({
    ...requestTableQuery({ type: 'leave', status: 'pending', page: 1, pageSize: 1 }),
    enabled: canApprove,
  });
  const drafts = useQuery({ ...draftPeriodsQuery(), enabled: canPlan });
  const open = useQuery(openShiftsQuery(1, false, MAX_PAGE_SIZE));
  const units = useQuery(unitsQuery());
  const unitOf = new Map((units.data ?? []).map((u) => [u.id, u]));
  const queries = [swaps, leave, drafts, open, units].filter((q) => q.fetchStatus !== 'idle' || q.data);
  const failed = queries.find((q) => q.isError);
  const loading = queries.some((q) => q.isPending);

  const items: ReactNode[] = [];
  // Red flags of safe staffing (NICE SG1) on published rosters come first for those who plan: they can
  // hurt someone, and the planner is the one who books bank or agency staff and escalates.
  const redFlags = canPlan ? (open.data?.items ?? []).flatMap((o) => (o.redFlag ? [o.redFlag] : [])) : [];
  if (redFlags.length > 0) {
    items.push(
      <WaitingItem
        key="red-flags"
        to={PATHS.openShifts}
        icon={<WarningRegular />}
        urgent
        badge="Red flag"
        title={`${plural(redFlags.length, 'red flag', 'red flags')} of safe staffing on published rosters`}
        detail={`Red flag (${RED_FLAG_SOURCE}): ${redFlags[0].text}${redFlags.length > 1 ? `; and ${redFlags.length - 1} more` : ''}. ${RED_FLAG_CAUTION}`}
      />,
    );
  }
  const swapCount = swaps.data?.total ?? 0;
  if (swapCount > 0) {
    items.push(
      <WaitingItem
        key="swaps"
        to={PATHS.swapApprovals}
        icon={<PeopleSwapRegular />}
        title={`${plural(swapCount, 'swap or open-shift claim', 'swaps and open-shift claims')} to decide`}
      />,
    );
  }
  const leaveCount = leave.data?.total ?? 0;
  if (leaveCount > 0) {
    items.push(
      <WaitingItem
        key="leave"
        to={PATHS.requests}
        icon={<PersonClockRegular />}
        title={`${plural(leaveCount, 'leave request', 'leave requests')} to decide`}
      />,
    );
  }
  const openShifts = open.data?.items ?? [];
  const belowMin = openShifts.filter((o) => o.belowMinimum > 0);
  if (belowMin.length > 0) {
    const first = belowMin[0];
    items.push(
      <WaitingItem
        key="below-min"
        to={PATHS.openShifts}
        icon={<WarningRegular />}
        urgent
        title={`${plural(belowMin.length, 'shift is', 'shifts are')} below minimum staffing on published rosters`}
        detail={`First: ${dayLabel(first.date)}, ${first.shiftName}${first.skillCode ? ` (${first.skillCode})` : ''}. Offer it to the staff who may take it, or to bank or agency staff, as local policy says.`}
      />,
    );
  }
  const onlyTarget = (open.data?.total ?? 0) - belowMin.length;
  if (onlyTarget > 0) {
    items.push(
      <WaitingItem
        key="open"
        to={PATHS.openShifts}
        icon={<PeopleSwapRegular />}
        title={`${plural(onlyTarget, 'open shift', 'open shifts')} below target, unfilled`}
      />,
    );
  }
  for (const p of [...(drafts.data ?? [])].sort((a, b) => a.startDate.localeCompare(b.startDate))) {
    const unit = unitOf.get(p.unitId);
    const lead = unit?.publishLeadDays ?? PUBLISH_LEAD_DAYS_DEFAULT;
    const due = publishDeadline(p, lead, todayIn(unit?.timeZone ?? 'UTC'));
    const when = due.late
      ? `Publish was due ${dayLabel(due.publishBy)} (${lead} days' notice): ${plural(-due.daysLeft, 'day', 'days')} late`
      : `Publish by ${dayLabel(due.publishBy)} (${lead} days' notice): ${plural(due.daysLeft, 'day', 'days')} left`;
    items.push(
      <WaitingItem
        key={p.id}
        to={PATHS.planningBoard(p.id)}
        icon={<CalendarLtrRegular />}
        urgent={due.late}
        badge={due.late ? 'Late' : undefined}
        title={`Generate and publish ${unit?.name ?? 'a unit'}: ${dayLabel(p.startDate)} to ${dayLabel(lastDay(p))}`}
        detail={when}
      />,
    );
  }

  return (
    <section className={surface.panel} aria-labelledby="home-waiting">
      <Subtitle1 as="h2" id="home-waiting">
        Waiting for you
      </Subtitle1>
      {failed?.error ? <ErrorBanner error={failed.error} onRetry={() => void failed.refetch()} /> : null}
      {loading && items.length === 0 ? (
        <TableSkeleton rows={3} label="Reading what waits for you" />
      ) : items.length === 0 ? (
        <Body1>Nothing waits for you: no requests to decide, no drafts to publish and no open shifts.</Body1>
      ) : (
        <ul className={styles.list} aria-label="Waiting for you">
          {items}
        </ul>
      )}
    </section>
  );
}
