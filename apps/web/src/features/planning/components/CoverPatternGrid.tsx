import { useId, useState } from 'react';
import {
  Button,
  Caption1,
  Checkbox,
  Field,
  Input,
  Label,
  makeStyles,
  mergeClasses,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  Spinner,
  Subtitle2,
  tokens,
} from '@fluentui/react-components';
import { AddRegular, CopyRegular, SaveRegular } from '@fluentui/react-icons';
import {
  GUARD_RAIL_DEFERRAL,
  loweredToZeroCautions,
  WEEKDAY_NAMES,
  type CoverNeedsDto,
  type ShiftTypeDto,
  type SkillDto,
} from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { planningKeys, replaceCoverPattern } from '@/features/planning/api/planning.queries';
import {
  addLine,
  cellKey,
  copyDay,
  GRID_WEEKDAYS,
  gridFromPattern,
  lineKey,
  patternFromGrid,
  setCell,
  type CoverLine,
} from '@/features/planning/utils/coverGrid';
import { ShiftChip } from './ShiftChip';

const DAY_LONG = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'] as const;

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  tools: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'flex-end',
    gap: tokens.spacingHorizontalL,
    padding: tokens.spacingHorizontalM,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground2,
  },
  group: { display: 'flex', alignItems: 'flex-end', gap: tokens.spacingHorizontalS, flexWrap: 'wrap' },
  days: { display: 'flex', flexWrap: 'wrap' },
  toDays: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXXS },
  scroll: { overflowX: 'auto' },
  grid: { borderCollapse: 'collapse', minWidth: '56rem', width: '100%' },
  th: {
    textAlign: 'left',
    fontWeight: tokens.fontWeightSemibold,
    fontSize: tokens.fontSizeBase200,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalS}`,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    whiteSpace: 'nowrap',
  },
  rowHead: {
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalS}`,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke3}`,
    whiteSpace: 'nowrap',
    fontWeight: tokens.fontWeightRegular,
    textAlign: 'left',
  },
  rowHeadInner: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalS },
  cell: {
    padding: `${tokens.spacingVerticalXS} ${tokens.spacingHorizontalXS}`,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke3}`,
    verticalAlign: 'top',
  },
  weekend: { backgroundColor: tokens.colorNeutralBackground2 },
  pair: { display: 'flex', gap: tokens.spacingHorizontalXXS, alignItems: 'center' },
  count: { width: '3.25rem', minWidth: '3.25rem' },
  cellError: { color: tokens.colorPaletteRedForeground1, fontSize: tokens.fontSizeBase100, maxWidth: '7rem' },
  muted: { color: tokens.colorNeutralForeground3 },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, alignItems: 'center' },
});

export interface CoverPatternGridProps {
  unitId: string;
  needs: CoverNeedsDto;
  shiftTypes: readonly ShiftTypeDto[];
  skills: readonly SkillDto[];
}

/**
 * The weekly cover pattern as a grid: one line per shift type and skill, one column per weekday,
 * each cell a minimum and a target headcount. Edits stay local until saved as a whole.
 */
export function CoverPatternGrid({ unitId, needs, shiftTypes, skills }: CoverPatternGridProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const order = shiftTypes.map((s) => s.id);
  const [lines, setLines] = useState<CoverLine[]>(() => gridFromPattern(needs.pattern, order));
  const [dirty, setDirty] = useState(false);
  const [showErrors, setShowErrors] = useState(false);
  const [newShift, setNewShift] = useState(shiftTypes[0]?.id ?? '');
  const [newSkill, setNewSkill] = useState('');
  const [copyFrom, setCopyFrom] = useState<number>(1);
  const [copyTo, setCopyTo] = useState<number[]>([]);
  const copyToId = useId();

  const shiftById = new Map(shiftTypes.map((s) => [s.id, s]));
  const skillById = new Map(skills.map((s) => [s.id, s]));
  const { rows, errors } = patternFromGrid(lines);
  const errorCount = Object.keys(errors).length;
  // Minimums above 0 in the saved pattern that these edits set to 0 (or drop): shown before saving.
  const lowered = dirty
    ? loweredToZeroCautions(
        needs.pattern.map((r) => ({ ...r, day: r.weekday })),
        rows.map((r) => ({ ...r, day: r.weekday })),
        (r) => {
          const shift = shiftById.get(r.shiftTypeId);
          const skill = r.skillId ? `, skill ${skillById.get(r.skillId)?.code ?? 'unknown'}` : '';
          return `${shift ? `${shift.name} (${shift.code})` : 'A shift'} on ${WEEKDAY_NAMES[Number(r.day)]}${skill}`;
        },
      )
    : [];

  const change = (next: CoverLine[]) => {
    setLines(next);
    setDirty(true);
  };

  const save = useMutation({
    mutationFn: () => replaceCoverPattern(unitId, { rows }),
    onSuccess: (saved) => {
      queryClient.setQueryData(planningKeys.coverNeeds(unitId), saved);
      setLines(gridFromPattern(saved.pattern, order));
      setDirty(false);
      setShowErrors(false);
      notify(
        saved.cautions?.length
          ? 'Saved the weekly cover pattern: some shifts no longer have a minimum cover'
          : 'Saved the weekly cover pattern',
        saved.cautions?.length ? 'warning' : 'success',
      );
    },
  });

  const handleSave = () => {
    setShowErrors(true);
    if (errorCount === 0) save.mutate();
  };

  const lineName = (l: CoverLine) => {
    const shift = shiftById.get(l.shiftTypeId);
    const skill = l.skillId ? skillById.get(l.skillId) : undefined;
    return `${shift?.name ?? 'Unknown shift'}, ${l.skillId ? (skill?.name ?? 'unknown skill') : 'anyone'}`;
  };

  return (
    <div className={styles.root}>
      <div className={styles.tools}>
        <div className={styles.group} role="group" aria-label="Add a row">
          <Field label="Shift type">
            <Select value={newShift} onChange={(_, d) => setNewShift(d.value)}>
              {shiftTypes.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.code} · {s.name}
                </option>
              ))}
            </Select>
          </Field>
          <Field label="Skill needed">
            <Select value={newSkill} onChange={(_, d) => setNewSkill(d.value)}>
              <option value="">Anyone on the shift</option>
              {skills.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.code} · {s.name}
                </option>
              ))}
            </Select>
          </Field>
          <Button
            icon={<AddRegular />}
            disabled={!newShift}
            onClick={() => change(addLine(lines, newShift, newSkill || null))}
          >
            Add row
          </Button>
        </div>
        <div className={styles.group} role="group" aria-label="Copy a day">
          <Field label="Copy the needs of">
            <Select value={String(copyFrom)} onChange={(_, d) => setCopyFrom(Number(d.value))}>
              {GRID_WEEKDAYS.map((d) => (
                <option key={d} value={d}>
                  {DAY_LONG[d]}
                </option>
              ))}
            </Select>
          </Field>
          <div className={styles.toDays}>
            <Label id={copyToId}>To</Label>
            <div className={styles.days} role="group" aria-labelledby={copyToId}>
              {GRID_WEEKDAYS.filter((d) => d !== copyFrom).map((d) => (
                <Checkbox
                  key={d}
                  label={WEEKDAY_NAMES[d]}
                  aria-label={`Copy to ${DAY_LONG[d]}`}
                  checked={copyTo.includes(d)}
                  onChange={(_, data) =>
                    setCopyTo((prev) => (data.checked === true ? [...prev, d] : prev.filter((x) => x !== d)))
                  }
                />
              ))}
            </div>
          </div>
          <Button
            icon={<CopyRegular />}
            disabled={copyTo.filter((d) => d !== copyFrom).length === 0 || lines.length === 0}
            onClick={() => {
              change(copyDay(lines, copyFrom, copyTo));
              setCopyTo([]);
            }}
          >
            Copy
          </Button>
        </div>
      </div>

      {lines.length === 0 ? (
        <MessageBar intent="info">
          <MessageBarBody>
            No weekly needs yet. Choose a shift type and a skill above and add a row, then type the minimum
            and target headcount for each day.
          </MessageBarBody>
        </MessageBar>
      ) : (
        <div className={styles.scroll}>
          <table className={styles.grid} aria-label="Weekly cover pattern">
            <thead>
              <tr>
                <th className={styles.th} scope="col">
                  Shift and skill
                  <Caption1 className={styles.muted} as="span" block>
                    each day: minimum, target
                  </Caption1>
                </th>
                {GRID_WEEKDAYS.map((d) => (
                  <th key={d} scope="col" className={styles.th}>
                    {DAY_LONG[d]}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {lines.map((l) => {
                const key = lineKey(l.shiftTypeId, l.skillId);
                const shift = shiftById.get(l.shiftTypeId);
                const name = lineName(l);
                return (
                  <tr key={key}>
                    <th scope="row" className={styles.rowHead}>
                      <span className={styles.rowHeadInner}>
                        {shift && <ShiftChip code={shift.code} colour={shift.colour} />}
                        <span>
                          {shift?.name ?? 'Unknown shift'}
                          <br />
                          <Caption1 className={styles.muted}>
                            {l.skillId ? (skillById.get(l.skillId)?.name ?? 'Unknown skill') : 'Anyone'}
                          </Caption1>
                        </span>
                      </span>
                    </th>
                    {GRID_WEEKDAYS.map((d) => {
                      const cell = l.cells[d];
                      const error = showErrors ? errors[cellKey(key, d)] : undefined;
                      const errorId = `${key}-${d}-error`;
                      return (
                        <td
                          key={d}
                          className={mergeClasses(styles.cell, (d === 0 || d === 6) && styles.weekend)}
                        >
                          <div className={styles.pair}>
                            <Input
                              className={styles.count}
                              size="small"
                              inputMode="numeric"
                              aria-label={`${name}, ${DAY_LONG[d]}, minimum`}
                              aria-invalid={!!error}
                              aria-describedby={error ? errorId : undefined}
                              value={cell.min}
                              onChange={(_, data) => change(setCell(lines, key, d, { min: data.value }))}
                            />
                            <Input
                              className={styles.count}
                              size="small"
                              inputMode="numeric"
                              aria-label={`${name}, ${DAY_LONG[d]}, target`}
                              aria-invalid={!!error}
                              aria-describedby={error ? errorId : undefined}
                              placeholder={cell.min}
                              value={cell.target}
                              onChange={(_, data) => change(setCell(lines, key, d, { target: data.value }))}
                            />
                          </div>
                          {error && (
                            <div id={errorId} className={styles.cellError}>
                              {error}
                            </div>
                          )}
                        </td>
                      );
                    })}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      {showErrors && errorCount > 0 && (
        <ErrorBanner
          messages={[
            `${errorCount} cell${errorCount === 1 ? ' needs' : 's need'} correcting before the pattern can be saved.`,
          ]}
        />
      )}
      {lowered.length > 0 && (
        <MessageBar intent="warning" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>Minimum cover removed</MessageBarTitle>
            <ul aria-label="Minimums lowered to 0">
              {lowered.slice(0, 6).map((text) => (
                <li key={text}>{text}</li>
              ))}
              {lowered.length > 6 && <li>and {lowered.length - 6} more.</li>}
            </ul>
            {GUARD_RAIL_DEFERRAL}
          </MessageBarBody>
        </MessageBar>
      )}
      <ErrorBanner error={save.error} />
      <div className={styles.actions}>
        <Button
          appearance="primary"
          icon={save.isPending ? <Spinner size="tiny" /> : <SaveRegular />}
          disabled={!dirty || save.isPending}
          onClick={handleSave}
        >
          Save weekly pattern
        </Button>
        <Button
          disabled={!dirty || save.isPending}
          onClick={() => {
            setLines(gridFromPattern(needs.pattern, order));
            setDirty(false);
            setShowErrors(false);
          }}
        >
          Discard changes
        </Button>
        <Subtitle2 as="span" className={styles.muted} aria-live="polite">
          {dirty ? 'Unsaved changes' : ''}
        </Subtitle2>
      </div>
      <Caption1 className={styles.muted}>
        An empty target means the same as the minimum. A cell with no numbers, or 0 and 0, has no need.
      </Caption1>
    </div>
  );
}
