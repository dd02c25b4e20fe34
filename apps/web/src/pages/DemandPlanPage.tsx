import { useState } from 'react';
import {
  Body1,
  Button,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  Subtitle1,
  tokens,
} from '@fluentui/react-components';
import { CheckmarkRegular, DataLineRegular } from '@fluentui/react-icons';
import type { DemandPlanDto, RosterPeriodDto, ShiftTypeDto, SkillDto } from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { PATHS } from '@/app/paths';
import {
  acceptDemandPlan,
  demandAcceptancesQuery,
  demandKeys,
  demandPlanQuery,
} from '@/features/demand/api/demand.queries';
import { AcceptPlanDialog } from '@/features/demand/components/AcceptPlanDialog';
import { DemandCoverChart, ServiceLevelChart } from '@/features/demand/components/DemandCharts';
import { StartsTable, WardRequirementTable } from '@/features/demand/components/PlanTables';
import {
  acceptRows,
  addDays,
  busyPart,
  coverChanges,
  intervalPoints,
  underCoverWords,
} from '@/features/demand/utils/demandFigures';
import { rosterPeriodQuery } from '@/features/planning-board/api/board.queries';
import { formatDay } from '@/features/planning-board/utils/days';
import {
  coverNeedsQuery,
  planningKeys,
  shiftTypesQuery,
  skillsQuery,
} from '@/features/planning/api/planning.queries';
import { usePlanningStyles } from '@/features/planning/components/planningStyles';
import { unitsQuery } from '@/features/units/api/units.queries';
import { AppLink } from '@/ui/AppLink';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { PageHeader } from '@/ui/PageHeader';

const useStyles = makeStyles({
  figures: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(10rem, 1fr))',
    gap: tokens.spacingHorizontalL,
    margin: 0,
    '& dt': { color: tokens.colorNeutralForeground3 },
    '& dd': { margin: 0, fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold },
  },
  pickers: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL, alignItems: 'flex-end' },
  picker: { minWidth: '12rem' },
  charts: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(min(100%, 32rem), 1fr))',
    gap: tokens.spacingHorizontalL,
  },
  tableScroll: { maxHeight: '60vh', overflow: 'auto' },
  accept: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'center' },
  list: { margin: 0, paddingLeft: tokens.spacingHorizontalL },
});

export function DemandPlanPage() {
  const { periodId = '' } = useParams();
  const period = useQuery(rosterPeriodQuery(periodId));
  const units = useQuery(unitsQuery());
  const unitId = period.data?.unitId ?? '';
  const plan = useQuery(demandPlanQuery(periodId));
  const shiftTypes = useQuery(shiftTypesQuery(unitId));
  const skills = useQuery(skillsQuery());
  const failed = period.error ?? plan.error ?? shiftTypes.error ?? skills.error;
  const p = period.data;
  const unitName = units.data?.find((u) => u.id === unitId)?.name ?? 'Unit';
  const header = p && (
    <PageHeader
      title={`Demand plan: ${unitName}`}
      description={
        <>
          {formatDay(p.startDate)} to {formatDay(addDays(p.startDate, p.days - 1))}, {p.days} days, {p.status}
          .{' '}
          <AppLink to={`${PATHS.demand}?unit=${p.unitId}`} inline>
            Demand of the unit
          </AppLink>
          {' · '}
          <AppLink to={PATHS.planningBoard(p.id)} inline>
            Planning board
          </AppLink>
          {' · '}
          <AppLink to={`${PATHS.coverNeeds}?unit=${p.unitId}`} inline>
            Cover needs
          </AppLink>
        </>
      }
    />
  );
  if (failed)
    return (
      <>
        {header}
        <ErrorBanner
          error={failed}
          onRetry={() => {
            void period.refetch();
            void plan.refetch();
          }}
        />
      </>
    );
  if (!p || !plan.data || !shiftTypes.data || !skills.data)
    return (
      <>
        {header}
        <LoadingState label="Working out the requirement and the shifts that cover it…" />
      </>
    );
  return (
    <>
      {header}
      <PlanBody period={p} plan={plan.data} shiftTypes={shiftTypes.data} skills={skills.data} />
    </>
  );
}

interface PlanBodyProps {
  period: RosterPeriodDto;
  plan: DemandPlanDto;
  shiftTypes: readonly ShiftTypeDto[];
  skills: readonly SkillDto[];
}

function PlanBody({ period, plan, shiftTypes, skills }: PlanBodyProps) {
  const styles = useStyles();
  const planning = usePlanningStyles();
  const cc = plan.contactCentre;
  if (!cc && !plan.ward)
    return (
      <EmptyState icon={<DataLineRegular />} title="This unit has no demand yet">
        Enter a contact forecast or patients and ratios on the{' '}
        <AppLink to={`${PATHS.demand}?unit=${period.unitId}`}>demand page</AppLink> first.
      </EmptyState>
    );
  return (
    <div className={planning.stack}>
      {plan.cautions.length > 0 && (
        <MessageBar intent="warning" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>Before you accept</MessageBarTitle>
            <ul className={styles.list} aria-label="Cautions on this plan">
              {plan.cautions.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          </MessageBarBody>
        </MessageBar>
      )}
      {cc && <ContactPlanSummary plan={cc} dates={plan.dates} shiftTypes={shiftTypes} />}
      {plan.ward && (
        <section className={planning.panel} aria-labelledby="ward-requirement">
          <Subtitle1 as="h2" id="ward-requirement">
            Ward requirement per shift
          </Subtitle1>
          <Body1>
            Per skill: the patients of each acuity level divided by the patients one person cares for, rounded
            up, and never below the skill&apos;s floor.
          </Body1>
          <div className={styles.tableScroll}>
            <WardRequirementTable
              requirement={plan.ward.requirement}
              shiftTypes={shiftTypes}
              skills={skills}
            />
          </div>
        </section>
      )}
      <AcceptSection period={period} plan={plan} shiftTypes={shiftTypes} skills={skills} />
      {cc && <ContactCharts plan={cc} dates={plan.dates} />}
      <Acceptances periodId={period.id} />
    </div>
  );
}

function ContactPlanSummary({
  plan,
  dates,
  shiftTypes,
}: {
  plan: NonNullable<DemandPlanDto['contactCentre']>;
  dates: readonly string[];
  shiftTypes: readonly ShiftTypeDto[];
}) {
  const styles = useStyles();
  const planning = usePlanningStyles();
  const peak = plan.requirement.reduce((m, r) => Math.max(m, r.scheduled), 0);
  const s = plan.service;
  return (
    <section className={planning.panel} aria-labelledby="covering-plan">
      <Subtitle1 as="h2" id="covering-plan">
        Covering plan
      </Subtitle1>
      <Body1>
        {`Erlang C gives the fewest agents for ${s.targetPercent}% of contacts answered within ${s.targetSeconds} s with occupancy at most ${s.maxOccupancyPercent}%; ${s.shrinkagePercent}% shrinkage is added on top. The plan then opens the shifts that cover every interval at the fewest paid hours.`}
      </Body1>
      <dl className={styles.figures}>
        <div>
          <dt>Paid hours</dt>
          <dd>{plan.paidHours.toFixed(1)}</dd>
        </div>
        <div>
          <dt>Requirement at its peak</dt>
          <dd>{`${peak} people`}</dd>
        </div>
        <div>
          <dt>Plan</dt>
          <dd>{plan.solverStatus === 'optimal' ? 'Fewest paid hours' : 'Best found in the time limit'}</dd>
        </div>
      </dl>
      <Body1>{underCoverWords(plan)}</Body1>
      <div className={styles.tableScroll}>
        <StartsTable plan={plan} dates={dates} shiftTypes={shiftTypes} />
      </div>
    </section>
  );
}

function ContactCharts({
  plan,
  dates,
}: {
  plan: NonNullable<DemandPlanDto['contactCentre']>;
  dates: readonly string[];
}) {
  const styles = useStyles();
  const busiest = dates.reduce((best, d) => {
    const sum = (x: string) =>
      plan.requirement.filter((r) => r.start.startsWith(x)).reduce((s, r) => s + r.contacts, 0);
    return sum(d) > sum(best) ? d : best;
  }, dates[0]);
  const [day, setDay] = useState(busiest);
  const weeks = Array.from({ length: Math.ceil(dates.length / 7) }, (_, i) => dates.slice(i * 7, i * 7 + 7));
  const [week, setWeek] = useState(0);
  const dayPoints = busyPart(intervalPoints(plan, [day], false));
  const weekPoints = intervalPoints(plan, weeks[week] ?? [], true);
  const s = plan.service;
  return (
    <>
      <div className={styles.pickers}>
        <Field label="Day" className={styles.picker}>
          <Select value={day} onChange={(_, d) => setDay(d.value)}>
            {dates.map((d) => (
              <option key={d} value={d}>
                {formatDay(d)}
              </option>
            ))}
          </Select>
        </Field>
        {weeks.length > 1 && (
          <Field label="Week" className={styles.picker}>
            <Select value={String(week)} onChange={(_, d) => setWeek(Number(d.value))}>
              {weeks.map((w, i) => (
                <option key={w[0]} value={i}>
                  {`${formatDay(w[0])} to ${formatDay(w[w.length - 1])}`}
                </option>
              ))}
            </Select>
          </Field>
        )}
      </div>
      <div className={styles.charts}>
        <DemandCoverChart title={`Demand and cover on ${formatDay(day)}`} points={dayPoints} />
        <ServiceLevelChart
          title={`Service level on ${formatDay(day)}`}
          points={dayPoints}
          targetPercent={s.targetPercent}
          targetSeconds={s.targetSeconds}
        />
      </div>
      <DemandCoverChart
        title={`Demand and cover over the week from ${formatDay(weeks[week]?.[0] ?? dates[0])}`}
        points={weekPoints}
      />
    </>
  );
}

function AcceptSection({ period, plan, shiftTypes, skills }: PlanBodyProps) {
  const styles = useStyles();
  const planning = usePlanningStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const needs = useQuery(coverNeedsQuery(period.unitId));
  const [asking, setAsking] = useState(false);
  const rows = acceptRows(plan);
  const accept = useMutation({
    mutationFn: () => acceptDemandPlan(period.id, { rows }),
    onSuccess: (result) => {
      void queryClient.invalidateQueries({ queryKey: planningKeys.coverNeeds(period.unitId) });
      void queryClient.invalidateQueries({ queryKey: demandKeys.acceptances(period.id) });
      setAsking(false);
      notify(`${result.written} cover need${result.written === 1 ? '' : 's'} set from the plan`);
    },
  });
  const archived = period.status === 'archived';
  return (
    <section className={planning.panel} aria-labelledby="accept-plan">
      <Subtitle1 as="h2" id="accept-plan">
        Accept as cover needs
      </Subtitle1>
      <Body1>
        {`Accepting sets ${rows.length} cover need${rows.length === 1 ? '' : 's'} of this period (a minimum and a target for each shift of each day) from the plan. Rostered cover below an accepted minimum is flagged on the board and at publish.`}
      </Body1>
      {accept.isSuccess && (
        <MessageBar intent="success" role="status">
          <MessageBarBody>
            {`${accept.data.written} cover needs set. `}
            <AppLink to={`${PATHS.coverNeeds}?unit=${period.unitId}`} inline>
              See the cover needs
            </AppLink>
          </MessageBarBody>
        </MessageBar>
      )}
      <div className={styles.accept}>
        <Button
          appearance="primary"
          icon={<CheckmarkRegular />}
          disabled={archived || rows.length === 0 || !needs.data}
          onClick={() => {
            accept.reset();
            setAsking(true);
          }}
        >
          Accept as cover needs
        </Button>
        {archived && <Body1>An archived period keeps its cover needs.</Body1>}
      </div>
      {asking && needs.data && (
        <AcceptPlanDialog
          changes={coverChanges(rows, needs.data)}
          shiftTypes={shiftTypes}
          skills={skills}
          hasWard={!!plan.ward}
          pending={accept.isPending}
          error={accept.error}
          onConfirm={() => accept.mutate()}
          onCancel={() => setAsking(false)}
        />
      )}
    </section>
  );
}

const atFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

function Acceptances({ periodId }: { periodId: string }) {
  const styles = useStyles();
  const planning = usePlanningStyles();
  const list = useQuery(demandAcceptancesQuery(periodId));
  if (!list.data || list.data.length === 0) return null;
  return (
    <section className={planning.panel} aria-labelledby="acceptances">
      <Subtitle1 as="h2" id="acceptances">
        Accepted before
      </Subtitle1>
      <ul className={styles.list}>
        {list.data.map((a) => (
          <li key={a.id}>{`${atFormat.format(new Date(a.at))}, ${a.actorName}: ${a.summary}`}</li>
        ))}
      </ul>
    </section>
  );
}
