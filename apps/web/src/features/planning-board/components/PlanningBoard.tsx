import { lazy, Suspense, useMemo, useState } from 'react';
import {
  Badge,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Tab,
  TabList,
  tokens,
} from '@fluentui/react-components';
import {
  BeachRegular,
  PersonFeedbackFilled,
  PersonFeedbackRegular,
  PinFilled,
  WarningFilled,
} from '@fluentui/react-icons';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import type { AssignmentGridDto, RosterPeriodDto } from '@rotaplex/contracts';
import { contractsQuery, shiftTypesQuery, skillsQuery } from '@/features/planning/api/planning.queries';
import { usePlanningStyles } from '@/features/planning/components/planningStyles';
import { errorText } from '@/api/errors';
import { unitsQuery } from '@/features/units/api/units.queries';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState, TableSkeleton } from '@/ui/LoadingState';
import {
  assignmentsQuery,
  boardKeys,
  coverNeedsQuery,
  editCell,
  periodRequestsQuery,
  setPinned,
  solveRunsQuery,
  unitStaffQuery,
} from '../api/board.queries';
import { useSolveRun } from '../hooks/useSolveRun';
import { coverLines, hoursAgainstContract } from '../utils/boardSummary';
import { requestMarks } from '../utils/requestMarks';
import { boardRedFlags, gradeUnmetNeeds, qualityLine, redFlagsByCell } from '../utils/boardQuality';
import { BoardGrid } from './BoardGrid';
import { CellDialog } from './CellDialog';
import { SolvePanel } from './SolvePanel';
import { draftContents } from '../utils/draftContents';
import { PublishControls } from '@/features/publishing/components/PublishControls';
import type { CalendarLayout } from './PeriodCalendar';
import { ViolationsPanel } from './ViolationsPanel';

// FullCalendar loads only when someone opens the calendar view (its own chunk).
const PeriodCalendar = lazy(() => import('./PeriodCalendar').then((m) => ({ default: m.PeriodCalendar })));

export type BoardView = 'board' | 'calendar';

const useStyles = makeStyles({
  legend: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalL,
    color: tokens.colorNeutralForeground2,
  },
  legendItem: { display: 'inline-flex', alignItems: 'center', gap: tokens.spacingHorizontalXS },
  honoured: { color: tokens.colorPaletteGreenForeground1 },
  notHonoured: { color: tokens.colorPaletteDarkOrangeForeground1 },
});

/** The planning board of one roster period: grid, cover, hours, Generate with progress, and findings. */
export function PlanningBoard({ period }: { period: RosterPeriodDto }) {
  const styles = useStyles();
  const planning = usePlanningStyles();
  const queryClient = useQueryClient();
  const grid = useQuery(assignmentsQuery(period.id));
  const runs = useQuery(solveRunsQuery(period.id));
  const shiftTypes = useQuery(shiftTypesQuery(period.unitId));
  const skills = useQuery(skillsQuery());
  const contracts = useQuery(contractsQuery());
  const staff = useQuery(unitStaffQuery(period.unitId));
  const needs = useQuery(coverNeedsQuery(period.unitId));
  const requests = useQuery(periodRequestsQuery(period.id));
  const latestRun = runs.data
    ? [...runs.data].sort((a, b) => b.createdAt.localeCompare(a.createdAt))[0]
    : undefined;
  const solve = useSolveRun(period.id, latestRun);
  const units = useQuery(unitsQuery());
  const timeZone = units.data?.find((u) => u.id === period.unitId)?.timeZone;
  const [open, setOpen] = useState<{ staffMemberId: string; date: string } | null>(null);
  const readOnly = period.status !== 'draft';
  // The view, the calendar's layout and its person filter live in the URL (?view=calendar&layout=month).
  const [params, setParams] = useSearchParams();
  const view: BoardView = params.get('view') === 'calendar' ? 'calendar' : 'board';
  const layout: CalendarLayout = params.get('layout') === 'month' ? 'month' : 'week';
  const person = params.get('person');
  const setParam = (key: string, value: string | null) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (value === null) next.delete(key);
        else next.set(key, value);
        return next;
      },
      { replace: true },
    );

  const maps = useMemo(() => {
    const shiftTypeMap = new Map((shiftTypes.data ?? []).map((s) => [s.id, s]));
    const skillMap = new Map((skills.data ?? []).map((s) => [s.id, s]));
    const staffMap = new Map((staff.data ?? []).map((s) => [s.id, s]));
    const contractMap = new Map((contracts.data ?? []).map((c) => [c.id, c]));
    const names = new Map((grid.data?.rows ?? []).map((r) => [r.staffMemberId, r.name]));
    return { shiftTypeMap, skillMap, staffMap, contractMap, names };
  }, [shiftTypes.data, skills.data, staff.data, contracts.data, grid.data]);

  const cover = useMemo(
    () =>
      grid.data && shiftTypes.data && needs.data && skills.data
        ? coverLines(grid.data, shiftTypes.data, needs.data, skills.data, maps.staffMap)
        : [],
    [grid.data, shiftTypes.data, needs.data, skills.data, maps.staffMap],
  );
  const hours = useMemo(() => {
    const out = new Map<string, ReturnType<typeof hoursAgainstContract>>();
    for (const row of grid.data?.rows ?? []) {
      const contractId = maps.staffMap.get(row.staffMemberId)?.contractId;
      const contract = contractId ? maps.contractMap.get(contractId) : undefined;
      out.set(row.staffMemberId, hoursAgainstContract(row.cells, maps.shiftTypeMap, contract, period.days));
    }
    return out;
  }, [grid.data, maps, period.days]);
  const flagged = useMemo(
    () =>
      new Set(
        (grid.data?.check.violations ?? []).flatMap((v) => v.dates.map((d) => `${v.staffMemberId}|${d}`)),
      ),
    [grid.data],
  );

  const marks = useMemo(
    () => (grid.data && requests.data ? requestMarks(grid.data, requests.data) : undefined),
    [grid.data, requests.data],
  );

  // An edit or pin raises the period's version on the server: read the period again, so a publish
  // after editing sends the version it now has (a stale one is refused with 409).
  const store = (next: AssignmentGridDto) => {
    queryClient.setQueryData(boardKeys.grid(period.id), next);
    void queryClient.invalidateQueries({ queryKey: ['roster-periods'] });
  };

  const draft = useMemo(() => draftContents(grid.data), [grid.data]);
  const result = solve.run?.result ?? null;
  const graded = useMemo(
    () =>
      result && grid.data ? gradeUnmetNeeds(result.explanations.unmetNeeds, cover, grid.data.dates) : [],
    [result, cover, grid.data],
  );
  const redFlags = useMemo(
    () => (grid.data ? boardRedFlags(cover, grid.data.dates) : []),
    [cover, grid.data],
  );
  const redFlagCells = useMemo(() => redFlagsByCell(redFlags), [redFlags]);
  const qualityText = useMemo(
    () => (result ? qualityLine({ result, hours, marks }) : null),
    [result, hours, marks],
  );

  const failed = [grid, shiftTypes, skills, contracts, staff, needs, units].find((q) => q.isError);
  const running = solve.run?.status === 'queued' || solve.run?.status === 'running';
  const openRow = open && grid.data?.rows.find((r) => r.staffMemberId === open.staffMemberId);
  const openIndex = open && grid.data ? grid.data.dates.indexOf(open.date) : -1;

  return (
    <div className={planning.stack}>
      <section className={planning.panel}>
        <SolvePanel
          solve={solve}
          readOnly={readOnly}
          shiftTypes={maps.shiftTypeMap}
          skills={maps.skillMap}
          staffNames={maps.names}
          draft={draft}
          graded={graded}
          redFlags={redFlags}
          qualityText={qualityText}
        />
        <PublishControls period={period} solveActive={running} />
      </section>
      <section className={planning.panel} aria-label="Roster">
        <TabList
          aria-label="Roster view"
          selectedValue={view}
          onTabSelect={(_, d) => setParam('view', d.value === 'calendar' ? 'calendar' : null)}
        >
          <Tab value="board">Board</Tab>
          <Tab value="calendar">Calendar</Tab>
        </TabList>
        {failed?.error && <ErrorBanner error={failed.error} onRetry={() => void failed.refetch()} />}
        {grid.isPending && <TableSkeleton label="Loading the planning board" />}
        {requests.isError && (
          <MessageBar intent="warning">
            <MessageBarBody>
              Requests and leave could not be read, so they are not marked: {errorText(requests.error)}
            </MessageBarBody>
          </MessageBar>
        )}
        <div className={styles.legend}>
          {readOnly && (
            <Badge appearance="tint" color="success">
              Published: read-only
            </Badge>
          )}
          {running && <span>The solver is working; edits wait until it ends.</span>}
          <span className={styles.legendItem}>
            <PinFilled aria-hidden /> Pinned: kept by a new Generate
          </span>
          <span className={styles.legendItem}>
            <WarningFilled aria-hidden /> Has a rule finding
          </span>
          <span className={styles.legendItem}>
            <BeachRegular aria-hidden /> On leave (faint: pending)
          </span>
          <span className={styles.legendItem}>
            <PersonFeedbackRegular aria-hidden className={styles.honoured} /> Request honoured
          </span>
          <span className={styles.legendItem}>
            <PersonFeedbackFilled aria-hidden className={styles.notHonoured} /> Request not honoured
          </span>
          {view === 'board' ? (
            <span>· Day off. Arrow keys move between cells; Enter opens one.</span>
          ) : (
            <span>Select a shift (or press Enter on it) to open it.</span>
          )}
        </div>
        {grid.data && view === 'calendar' && (
          <Suspense fallback={<LoadingState label="Opening the calendar…" />}>
            {timeZone ? (
              <PeriodCalendar
                period={period}
                grid={grid.data}
                shiftTypes={maps.shiftTypeMap}
                flagged={flagged}
                timeZone={timeZone}
                layout={layout}
                onLayoutChange={(next) => setParam('layout', next === 'month' ? 'month' : null)}
                staffMemberId={person}
                onStaffMemberChange={(id) => setParam('person', id)}
                onOpenCell={(staffMemberId, date) => setOpen({ staffMemberId, date })}
                marks={marks}
              />
            ) : (
              <LoadingState label="Reading the unit's time zone…" />
            )}
          </Suspense>
        )}
        {grid.data && view === 'board' && (
          <BoardGrid
            grid={grid.data}
            shiftTypes={maps.shiftTypeMap}
            cover={cover}
            hours={hours}
            flagged={flagged}
            readOnly={readOnly || running}
            onOpenCell={(staffMemberId, date) => setOpen({ staffMemberId, date })}
            marks={marks}
            redFlags={redFlagCells}
          />
        )}
      </section>
      {grid.data && (
        <section className={planning.panel}>
          <ViolationsPanel violations={grid.data.check.violations} names={maps.names} />
        </section>
      )}
      {open && openRow && openIndex >= 0 && grid.data && (
        <CellDialog
          key={`${open.staffMemberId}|${open.date}`}
          name={openRow.name}
          date={open.date}
          cell={openRow.cells[openIndex]}
          shiftTypes={shiftTypes.data ?? []}
          violations={grid.data.check.violations.filter(
            (v) => v.staffMemberId === open.staffMemberId && v.dates.includes(open.date),
          )}
          onSave={async (shiftTypeId, overrideReason) =>
            store(
              await editCell(period.id, {
                staffMemberId: open.staffMemberId,
                date: open.date,
                shiftTypeId,
                ...(overrideReason ? { overrideReason } : {}),
              }),
            )
          }
          onPin={async (pinned) =>
            store(await setPinned(period.id, { staffMemberId: open.staffMemberId, date: open.date }, pinned))
          }
          onClose={() => setOpen(null)}
          readOnly={
            readOnly
              ? 'This period is published: change it through repair or swaps.'
              : running
                ? 'The solver is working; edits wait until it ends.'
                : null
          }
        />
      )}
    </div>
  );
}
