import { useMemo, useState } from 'react';
import {
  Body1,
  Button,
  Caption1,
  Checkbox,
  Field,
  Label,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  Spinner,
  Subtitle1,
  Switch,
  Tab,
  TabList,
  tokens,
} from '@fluentui/react-components';
import { ArrowUploadRegular, SaveRegular } from '@fluentui/react-icons';
import {
  DEMAND_INTERVAL_MINUTES,
  DEMAND_LIMITS,
  ERLANG_CAUTION,
  type ContactCentreDemandDto,
  type ContactIntervalDto,
  type DemandIntervalMinutes,
  type ServiceTargetDto,
  type ShiftTypeDto,
  type SkillDto,
} from '@rotaplex/contracts';
import { ErrorBanner } from '@/ui/ErrorBanner';
import {
  busyRange,
  dayStarts,
  fullWeek,
  rebucket,
  timeToMinutes,
  WEEKDAY_SHORT,
  WEEK_ORDER,
} from '../utils/demandFigures';
import { NumberCell } from './NumberCell';

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  fields: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL, alignItems: 'flex-end' },
  field: { width: '11rem' },
  scroll: { overflow: 'auto', maxHeight: '70vh', maxWidth: '100%' },
  grid: {
    borderCollapse: 'collapse',
    '& th, & td': {
      padding: `${tokens.spacingVerticalXXS} ${tokens.spacingHorizontalXS}`,
      textAlign: 'left',
    },
    '& thead th': {
      position: 'sticky',
      top: 0,
      zIndex: 1,
      backgroundColor: tokens.colorNeutralBackground1,
      fontWeight: tokens.fontWeightSemibold,
    },
    '& tbody th': {
      position: 'sticky',
      left: 0,
      backgroundColor: tokens.colorNeutralBackground1,
      fontWeight: tokens.fontWeightRegular,
      fontVariantNumeric: 'tabular-nums',
    },
  },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, alignItems: 'center' },
  muted: { color: tokens.colorNeutralForeground3 },
  group: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
});

/** A contact-centre part to start from: 30-minute intervals, 80% in 20 s, occupancy 85%, shrinkage 30%. */
export const NEW_CONTACT_DEMAND: ContactCentreDemandDto = {
  intervalMinutes: 30,
  skillId: null,
  service: { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 85, shrinkagePercent: 30 },
  pattern: [],
  dates: [],
  shiftTypeIds: [],
  maxPeoplePerDay: null,
};

const DEFAULT_AHT = 300;

export interface ContactDemandEditorProps {
  saved: ContactCentreDemandDto;
  shiftTypes: readonly ShiftTypeDto[];
  skills: readonly SkillDto[];
  saving: boolean;
  error: unknown;
  onSave: (value: ContactCentreDemandDto) => void;
  onUpload: () => void;
}

/** The week pattern of contacts and average handle time per interval, with the service target. */
export function ContactDemandEditor(props: ContactDemandEditorProps) {
  const { saved, shiftTypes, skills, saving, error, onSave, onUpload } = props;
  const styles = useStyles();
  const [draft, setDraft] = useState<ContactCentreDemandDto>(() => ({
    ...saved,
    pattern: fullWeek(saved.pattern),
  }));
  const [revision, setRevision] = useState(0);
  const [view, setView] = useState<'contacts' | 'aht'>('contacts');
  const [wholeDay, setWholeDay] = useState(false);

  const rows = useMemo(() => {
    const all = dayStarts(draft.intervalMinutes);
    const range = busyRange(draft.pattern);
    if (wholeDay || !range) return all;
    // The busy hours with an hour either side.
    const from = timeToMinutes(range[0]) - 60;
    const to = timeToMinutes(range[1]) + 60;
    return all.filter((s) => timeToMinutes(s) >= from && timeToMinutes(s) <= to);
  }, [draft.intervalMinutes, draft.pattern, wholeDay]);

  const setService = (key: keyof ServiceTargetDto, value: number) =>
    setDraft((d) => ({ ...d, service: { ...d.service, [key]: value } }));

  const setInterval = (to: DemandIntervalMinutes) => {
    setDraft((d) => ({
      ...d,
      intervalMinutes: to,
      pattern: d.pattern.map((w) => ({ ...w, intervals: rebucket(w.intervals, to, d.intervalMinutes) })),
      dates: d.dates.map((w) => ({ ...w, intervals: rebucket(w.intervals, to, d.intervalMinutes) })),
    }));
    setRevision((r) => r + 1);
  };

  const setCell = (weekday: number, start: string, field: 'contacts' | 'ahtSeconds', value: number) =>
    setDraft((d) => ({
      ...d,
      pattern: d.pattern.map((w) => {
        if (w.weekday !== weekday) return w;
        const found = w.intervals.find((i) => i.start === start);
        const intervals: ContactIntervalDto[] = found
          ? w.intervals.map((i) => (i.start === start ? { ...i, [field]: value } : i))
          : [...w.intervals, { start, contacts: 0, ahtSeconds: dayAht(w.intervals), [field]: value }].sort(
              (a, b) => a.start.localeCompare(b.start),
            );
        return { ...w, intervals };
      }),
    }));

  const handleSave = () =>
    onSave({
      ...draft,
      pattern: draft.pattern
        .map((w) => ({ ...w, intervals: w.intervals.filter((i) => i.contacts > 0) }))
        .filter((w) => w.intervals.length > 0),
    });

  const cellOf = (weekday: number, start: string) =>
    draft.pattern.find((w) => w.weekday === weekday)?.intervals.find((i) => i.start === start);
  const s = draft.service;
  return (
    <section className={styles.section} aria-labelledby="contact-demand">
      <Subtitle1 as="h2" id="contact-demand">
        Contact forecast
      </Subtitle1>
      <MessageBar intent="warning" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>An estimate, not a promise</MessageBarTitle>
          {ERLANG_CAUTION} Shrinkage of 20-35% is common; Rotaplex does not choose it for you.
        </MessageBarBody>
      </MessageBar>
      <div className={styles.fields}>
        <Field label="Interval" className={styles.field}>
          <Select
            value={String(draft.intervalMinutes)}
            onChange={(_, d) => setInterval(Number(d.value) as DemandIntervalMinutes)}
          >
            {DEMAND_INTERVAL_MINUTES.map((m) => (
              <option key={m} value={m}>
                {m} minutes
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Answered within target (%)" className={styles.field}>
          <NumberCell
            key={`tp${revision}`}
            label="Answered within target (%)"
            value={s.targetPercent}
            min={1}
            max={99.9}
            step={0.1}
            emptyIsZero={false}
            onChange={(v) => setService('targetPercent', v)}
          />
        </Field>
        <Field label="Target time (seconds)" className={styles.field}>
          <NumberCell
            key={`ts${revision}`}
            label="Target time (seconds)"
            value={s.targetSeconds}
            min={0}
            max={DEMAND_LIMITS.maxTargetSeconds}
            emptyIsZero={false}
            onChange={(v) => setService('targetSeconds', v)}
          />
        </Field>
        <Field label="Occupancy at most (%)" className={styles.field}>
          <NumberCell
            key={`oc${revision}`}
            label="Occupancy at most (%)"
            value={s.maxOccupancyPercent}
            min={50}
            max={100}
            emptyIsZero={false}
            onChange={(v) => setService('maxOccupancyPercent', v)}
          />
        </Field>
        <Field label="Shrinkage (%)" className={styles.field}>
          <NumberCell
            key={`sh${revision}`}
            label="Shrinkage (%)"
            value={s.shrinkagePercent}
            min={0}
            max={80}
            emptyIsZero={false}
            onChange={(v) => setService('shrinkagePercent', v)}
          />
        </Field>
        <Field label="Agents' skill" className={styles.field}>
          <Select
            value={draft.skillId ?? ''}
            onChange={(_, d) => setDraft((x) => ({ ...x, skillId: d.value || null }))}
          >
            <option value="">Anyone</option>
            {skills.map((k) => (
              <option key={k.id} value={k.id}>
                {k.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="People per day at most" hint="Empty: no cap" className={styles.field}>
          <NumberCell
            key={`cap${revision}`}
            label="People per day at most"
            value={draft.maxPeoplePerDay ?? undefined}
            min={1}
            max={DEMAND_LIMITS.maxPeoplePerDay}
            emptyIsZero={false}
            onChange={(v) => setDraft((x) => ({ ...x, maxPeoplePerDay: v }))}
            onEmpty={() => setDraft((x) => ({ ...x, maxPeoplePerDay: null }))}
          />
        </Field>
      </div>
      <div role="group" aria-labelledby="demand-shift-types" className={styles.group}>
        <Label id="demand-shift-types" weight="semibold">
          Shifts the plan may open
        </Label>
        <div className={styles.actions}>
          {shiftTypes.map((t) => (
            <Checkbox
              key={t.id}
              label={`${t.name} (${t.start}-${t.end})`}
              checked={draft.shiftTypeIds.includes(t.id)}
              onChange={(_, d) =>
                setDraft((x) => ({
                  ...x,
                  shiftTypeIds: d.checked
                    ? [...x.shiftTypeIds, t.id]
                    : x.shiftTypeIds.filter((id) => id !== t.id),
                }))
              }
            />
          ))}
        </div>
        <Caption1 className={styles.muted}>
          None ticked: any of the unit&apos;s shift types. A shift that crosses midnight covers the next
          morning.
        </Caption1>
      </div>
      {draft.dates.length > 0 && (
        <Body1 className={styles.muted}>
          {`${draft.dates.length} dated day${draft.dates.length === 1 ? '' : 's'} from a CSV replace their weekday.`}
        </Body1>
      )}
      <div className={styles.actions}>
        <TabList
          selectedValue={view}
          onTabSelect={(_, d) => setView(d.value as 'contacts' | 'aht')}
          aria-label="Values in the grid"
        >
          <Tab value="contacts">Contacts</Tab>
          <Tab value="aht">Average handle time (s)</Tab>
        </TabList>
        <Switch label="Show the whole day" checked={wholeDay} onChange={(_, d) => setWholeDay(d.checked)} />
      </div>
      <div className={styles.scroll}>
        <table
          className={styles.grid}
          aria-label={view === 'contacts' ? 'Contacts per interval' : 'Average handle time per interval'}
        >
          <thead>
            <tr>
              <th scope="col">Start</th>
              {WEEK_ORDER.map((w) => (
                <th key={w} scope="col">
                  {WEEKDAY_SHORT[w]}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((start) => (
              <tr key={start}>
                <th scope="row">{start}</th>
                {WEEK_ORDER.map((w) => {
                  const cell = cellOf(w, start);
                  return (
                    <td key={w}>
                      {view === 'contacts' ? (
                        <NumberCell
                          key={`c${revision}`}
                          label={`Contacts ${WEEKDAY_SHORT[w]} ${start}`}
                          value={cell?.contacts}
                          min={0}
                          max={DEMAND_LIMITS.maxContacts}
                          step={0.1}
                          onChange={(v) => setCell(w, start, 'contacts', v)}
                        />
                      ) : (
                        <NumberCell
                          key={`a${revision}`}
                          label={`Average handle time ${WEEKDAY_SHORT[w]} ${start}`}
                          value={cell?.ahtSeconds}
                          min={DEMAND_LIMITS.minAhtSeconds}
                          max={DEMAND_LIMITS.maxAhtSeconds}
                          emptyIsZero={false}
                          onChange={(v) => setCell(w, start, 'ahtSeconds', v)}
                        />
                      )}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <ErrorBanner error={error} />
      <div className={styles.actions}>
        <Button
          appearance="primary"
          icon={saving ? <Spinner size="tiny" /> : <SaveRegular />}
          disabled={saving}
          onClick={handleSave}
        >
          Save forecast
        </Button>
        <Button
          appearance="secondary"
          onClick={() => {
            setDraft({ ...saved, pattern: fullWeek(saved.pattern) });
            setRevision((r) => r + 1);
          }}
          disabled={saving}
        >
          Undo changes
        </Button>
        <Button icon={<ArrowUploadRegular />} onClick={onUpload} disabled={saving}>
          Upload contacts CSV
        </Button>
      </div>
    </section>
  );
}

/** AHT for a new interval of a day: the day's contact-weighted mean, or 300 s for an empty day. */
function dayAht(intervals: readonly ContactIntervalDto[]): number {
  const contacts = intervals.reduce((s, i) => s + i.contacts, 0);
  if (contacts === 0) return DEFAULT_AHT;
  return Math.round(intervals.reduce((s, i) => s + i.contacts * i.ahtSeconds, 0) / contacts);
}
