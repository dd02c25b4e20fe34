import {
  Body1,
  makeStyles,
  MessageBar,
  MessageBarBody,
  TableCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { GUARD_RAIL_DEFERRAL, RATIO_CAUTION, type ShiftTypeDto, type SkillDto } from '@rotaplex/contracts';
import { formatDay } from '@/features/planning-board/utils/days';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { DataTable } from '@/ui/DataTable';
import { unchanged, type CoverChange } from '../utils/demandFigures';

const useStyles = makeStyles({
  body: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  table: { maxHeight: '40vh', overflow: 'auto' },
});

export interface AcceptPlanDialogProps {
  changes: readonly CoverChange[];
  shiftTypes: readonly ShiftTypeDto[];
  skills: readonly SkillDto[];
  hasWard: boolean;
  pending: boolean;
  error: unknown;
  onConfirm: () => void;
  onCancel: () => void;
}

const before = (c: CoverChange, key: 'min' | 'target') => (c.before ? String(c.before[key]) : 'none');

/** Says, row by row, which minimum and target of which shift and day the plan will set, before it does. */
export function AcceptPlanDialog(props: AcceptPlanDialogProps) {
  const { changes, shiftTypes, skills, hasWard, pending, error, onConfirm, onCancel } = props;
  const styles = useStyles();
  const changed = changes.filter((c) => !unchanged(c));
  const lowered = changed.filter((c) => (c.before?.min ?? 0) > c.row.min).length;
  const toZero = changed.filter((c) => (c.before?.min ?? 0) > 0 && c.row.min === 0).length;
  const shiftName = (id: string) => shiftTypes.find((s) => s.id === id)?.name ?? 'Unknown shift';
  const skillName = (id: string | null) =>
    id ? (skills.find((k) => k.id === id)?.name ?? 'Unknown skill') : 'Anyone';
  return (
    <ConfirmDialog
      open
      title="Accept the plan as cover needs?"
      confirmLabel={`Accept ${changes.length} cover need${changes.length === 1 ? '' : 's'}`}
      pending={pending}
      error={error}
      onConfirm={onConfirm}
      onCancel={onCancel}
    >
      <div className={styles.body}>
        <Body1>
          {`Each shift of each day of the period gets the plan's minimum and target as a date override of the cover needs. ${changed.length === changes.length ? `All ${changes.length} change.` : `${changed.length} of ${changes.length} change; the others already have these numbers.`} The weekly pattern stays as it is, and you can change any override afterwards on the cover needs page.`}
        </Body1>
        {lowered > 0 && (
          <MessageBar intent="warning" layout="multiline">
            <MessageBarBody>
              {`${lowered} minimum${lowered === 1 ? ' is' : 's are'} lowered${toZero > 0 ? `, ${toZero} of them to 0` : ''}. Fewer people on shift than before: check that the forecast is right. ${GUARD_RAIL_DEFERRAL}`}
            </MessageBarBody>
          </MessageBar>
        )}
        {hasWard && (
          <MessageBar intent="warning" layout="multiline">
            <MessageBarBody>{RATIO_CAUTION}</MessageBarBody>
          </MessageBar>
        )}
        {changed.length > 0 && (
          <div className={styles.table}>
            <DataTable
              label="Cover needs the plan changes"
              columns={['Date', 'Shift', 'Skill', 'Minimum', 'Target']}
              size="small"
            >
              {changed.map((c) => (
                <TableRow key={`${c.row.date}|${c.row.shiftTypeId}|${c.row.skillId ?? ''}`}>
                  <TableCell>{formatDay(c.row.date)}</TableCell>
                  <TableCell>{shiftName(c.row.shiftTypeId)}</TableCell>
                  <TableCell>{skillName(c.row.skillId)}</TableCell>
                  <TableCell>{`${before(c, 'min')} → ${c.row.min}`}</TableCell>
                  <TableCell>{`${before(c, 'target')} → ${c.row.target}`}</TableCell>
                </TableRow>
              ))}
            </DataTable>
          </div>
        )}
      </div>
    </ConfirmDialog>
  );
}
