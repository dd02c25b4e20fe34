import { useState } from 'react';
import {
  Button,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  Spinner,
  Subtitle1,
  Subtitle2,
  tokens,
} from '@fluentui/react-components';
import { AddRegular, DeleteRegular, SaveRegular } from '@fluentui/react-icons';
import {
  ACUITY_LEVELS,
  DEMAND_LIMITS,
  RATIO_CAUTION,
  type AcuityMixDto,
  type ShiftTypeDto,
  type SkillDto,
  type WardDemandDto,
  type WardPatientsDto,
  type WardRatioDto,
} from '@rotaplex/contracts';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { WEEKDAY_SHORT, WEEK_ORDER } from '../utils/demandFigures';
import { NumberCell } from './NumberCell';

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  scroll: { overflow: 'auto', maxWidth: '100%', maxHeight: '70vh' },
  grid: {
    borderCollapse: 'collapse',
    '& th, & td': {
      padding: `${tokens.spacingVerticalXXS} ${tokens.spacingHorizontalXS}`,
      textAlign: 'left',
      verticalAlign: 'middle',
    },
    '& thead th': {
      position: 'sticky',
      top: 0,
      zIndex: 1,
      backgroundColor: tokens.colorNeutralBackground1,
      fontWeight: tokens.fontWeightSemibold,
    },
    '& tbody th': { fontWeight: tokens.fontWeightRegular, whiteSpace: 'nowrap' },
  },
  source: { minWidth: '16rem' },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, alignItems: 'center' },
});

const LEVEL_NAME: Record<(typeof ACUITY_LEVELS)[number], string> = {
  low: 'Low acuity',
  medium: 'Medium acuity',
  high: 'High acuity',
};

export const NEW_WARD_DEMAND: WardDemandDto = { patients: [], ratios: [] };

export interface WardDemandEditorProps {
  saved: WardDemandDto;
  shiftTypes: readonly ShiftTypeDto[];
  skills: readonly SkillDto[];
  saving: boolean;
  error: unknown;
  onSave: (value: WardDemandDto) => void;
}

/** Expected patients per weekday and shift type by acuity, and per skill a ratio with its floor. */
export function WardDemandEditor({
  saved,
  shiftTypes,
  skills,
  saving,
  error,
  onSave,
}: WardDemandEditorProps) {
  const styles = useStyles();
  const [draft, setDraft] = useState<WardDemandDto>(saved);
  const [revision, setRevision] = useState(0);
  const [newSkill, setNewSkill] = useState('');
  const skillName = (id: string) => skills.find((k) => k.id === id)?.name ?? 'Unknown skill';
  const unusedSkills = skills.filter((k) => !draft.ratios.some((r) => r.skillId === k.id));

  const patientsOf = (weekday: number, shiftTypeId: string) =>
    draft.patients.find((p) => p.weekday === weekday && p.date === null && p.shiftTypeId === shiftTypeId)
      ?.patients;
  const setPatients = (weekday: number, shiftTypeId: string, level: keyof AcuityMixDto, value: number) =>
    setDraft((d) => {
      const found = d.patients.some(
        (p) => p.weekday === weekday && p.date === null && p.shiftTypeId === shiftTypeId,
      );
      const patients: WardPatientsDto[] = found
        ? d.patients.map((p) =>
            p.weekday === weekday && p.date === null && p.shiftTypeId === shiftTypeId
              ? { ...p, patients: { ...p.patients, [level]: value } }
              : p,
          )
        : [
            ...d.patients,
            { weekday, date: null, shiftTypeId, patients: { low: 0, medium: 0, high: 0, [level]: value } },
          ];
      return { ...d, patients };
    });
  const setRatio = (skillId: string, change: Partial<WardRatioDto>) =>
    setDraft((d) => ({
      ...d,
      ratios: d.ratios.map((r) => (r.skillId === skillId ? { ...r, ...change } : r)),
    }));
  const datedRows = draft.patients.filter((p) => p.date !== null).length;

  return (
    <section className={styles.section} aria-labelledby="ward-demand">
      <Subtitle1 as="h2" id="ward-demand">
        Patients and ratios
      </Subtitle1>
      <MessageBar intent="warning" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>A ratio is a floor, not a target</MessageBarTitle>
          {RATIO_CAUTION}
        </MessageBarBody>
      </MessageBar>

      <Subtitle2 as="h3">Ratios per skill</Subtitle2>
      <div className={styles.scroll}>
        <table className={styles.grid} aria-label="Ratios per skill">
          <thead>
            <tr>
              <th scope="col">Skill</th>
              {ACUITY_LEVELS.map((l) => (
                <th key={l} scope="col">{`${LEVEL_NAME[l]}: patients per person`}</th>
              ))}
              <th scope="col">Floor: at least per shift</th>
              <th scope="col">Source (law, standard, policy)</th>
              <th scope="col">
                <span className="visually-hidden">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {draft.ratios.map((r) => (
              <tr key={r.skillId}>
                <th scope="row">{skillName(r.skillId)}</th>
                {ACUITY_LEVELS.map((l) => (
                  <td key={l}>
                    <NumberCell
                      key={revision}
                      label={`${skillName(r.skillId)}: ${LEVEL_NAME[l]} patients per person`}
                      value={r.patientsPerStaff[l]}
                      min={1}
                      max={DEMAND_LIMITS.maxPatientsPerStaff}
                      emptyIsZero={false}
                      onChange={(v) =>
                        setRatio(r.skillId, { patientsPerStaff: { ...r.patientsPerStaff, [l]: v } })
                      }
                    />
                  </td>
                ))}
                <td>
                  <NumberCell
                    key={revision}
                    label={`${skillName(r.skillId)}: at least per shift`}
                    value={r.minimumPerShift}
                    min={0}
                    max={50}
                    onChange={(v) => setRatio(r.skillId, { minimumPerShift: v })}
                  />
                </td>
                <td>
                  <Input
                    className={styles.source}
                    size="small"
                    aria-label={`${skillName(r.skillId)}: source of the ratio`}
                    value={r.source}
                    onChange={(_, d) => setRatio(r.skillId, { source: d.value })}
                  />
                </td>
                <td>
                  <Button
                    appearance="subtle"
                    size="small"
                    icon={<DeleteRegular />}
                    aria-label={`Remove the ratio of ${skillName(r.skillId)}`}
                    onClick={() =>
                      setDraft((d) => ({ ...d, ratios: d.ratios.filter((x) => x.skillId !== r.skillId) }))
                    }
                  />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {unusedSkills.length > 0 && (
        <div className={styles.actions}>
          <Select
            aria-label="Skill to add a ratio for"
            value={newSkill}
            onChange={(_, d) => setNewSkill(d.value)}
          >
            <option value="">Choose a skill…</option>
            {unusedSkills.map((k) => (
              <option key={k.id} value={k.id}>
                {k.name}
              </option>
            ))}
          </Select>
          <Button
            icon={<AddRegular />}
            disabled={!newSkill}
            onClick={() => {
              setDraft((d) => ({
                ...d,
                ratios: [
                  ...d.ratios,
                  {
                    skillId: newSkill,
                    patientsPerStaff: { low: 8, medium: 5, high: 2 },
                    minimumPerShift: 1,
                    source: '',
                  },
                ],
              }));
              setNewSkill('');
            }}
          >
            Add a ratio
          </Button>
        </div>
      )}

      <Subtitle2 as="h3">Expected patients per shift</Subtitle2>
      {datedRows > 0 && (
        <MessageBar intent="info">
          <MessageBarBody>{`${datedRows} dated row${datedRows === 1 ? '' : 's'} replace their weekday and are kept as they are.`}</MessageBarBody>
        </MessageBar>
      )}
      <div className={styles.scroll}>
        <table className={styles.grid} aria-label="Expected patients per shift">
          <thead>
            <tr>
              <th scope="col">Day</th>
              <th scope="col">Shift</th>
              {ACUITY_LEVELS.map((l) => (
                <th key={l} scope="col">
                  {LEVEL_NAME[l]}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {WEEK_ORDER.flatMap((w) =>
              shiftTypes.map((t) => {
                const mix = patientsOf(w, t.id);
                return (
                  <tr key={`${w}-${t.id}`}>
                    <th scope="row">{WEEKDAY_SHORT[w]}</th>
                    <td>{t.name}</td>
                    {ACUITY_LEVELS.map((l) => (
                      <td key={l}>
                        <NumberCell
                          key={revision}
                          label={`${WEEKDAY_SHORT[w]} ${t.name}: ${LEVEL_NAME[l]} patients`}
                          value={mix?.[l]}
                          min={0}
                          max={DEMAND_LIMITS.maxPatients}
                          onChange={(v) => setPatients(w, t.id, l, v)}
                        />
                      </td>
                    ))}
                  </tr>
                );
              }),
            )}
          </tbody>
        </table>
      </div>
      <ErrorBanner error={error} />
      <div className={styles.actions}>
        <Button
          appearance="primary"
          icon={saving ? <Spinner size="tiny" /> : <SaveRegular />}
          disabled={saving}
          onClick={() => onSave(draft)}
        >
          Save patients and ratios
        </Button>
        <Button
          appearance="secondary"
          disabled={saving}
          onClick={() => {
            setDraft(saved);
            setRevision((r) => r + 1);
          }}
        >
          Undo changes
        </Button>
      </div>
    </section>
  );
}
