import { TableCell, TableRow } from '@fluentui/react-components';
import type { DemandPlanDto, ShiftTypeDto, SkillDto } from '@rotaplex/contracts';
import { formatDay } from '@/features/planning-board/utils/days';
import { DataTable } from '@/ui/DataTable';

export interface StartsTableProps {
  plan: NonNullable<DemandPlanDto['contactCentre']>;
  dates: readonly string[];
  shiftTypes: readonly ShiftTypeDto[];
}

/** People starting each shift type each day: the plan's target, with its minimum (no shrinkage) beside it. */
export function StartsTable({ plan, dates, shiftTypes }: StartsTableProps) {
  const used = shiftTypes.filter((t) => plan.starts.some((s) => s.shiftTypeId === t.id));
  const cell = (date: string, shiftTypeId: string) =>
    plan.starts.find((s) => s.date === date && s.shiftTypeId === shiftTypeId);
  return (
    <DataTable
      label="People starting each shift"
      columns={['Date', ...used.map((t) => `${t.name} (${t.start}-${t.end})`)]}
      size="small"
    >
      {dates.map((date) => (
        <TableRow key={date}>
          <TableCell>{formatDay(date)}</TableCell>
          {used.map((t) => {
            const s = cell(date, t.id);
            return (
              <TableCell key={t.id}>
                {s && s.people > 0 ? `${s.people} (minimum ${s.minimum})` : '0'}
              </TableCell>
            );
          })}
        </TableRow>
      ))}
    </DataTable>
  );
}

export interface WardRequirementTableProps {
  requirement: NonNullable<DemandPlanDto['ward']>['requirement'];
  shiftTypes: readonly ShiftTypeDto[];
  skills: readonly SkillDto[];
}

/** People per skill each ward shift needs: by the ratio, the floor, and the larger of the two. */
export function WardRequirementTable({ requirement, shiftTypes, skills }: WardRequirementTableProps) {
  const shiftName = (id: string) => shiftTypes.find((s) => s.id === id)?.name ?? 'Unknown shift';
  const skillName = (id: string) => skills.find((k) => k.id === id)?.name ?? 'Unknown skill';
  return (
    <DataTable
      label="Ward requirement per shift"
      columns={['Date', 'Shift', 'Skill', 'Patients (low / medium / high)', 'By ratio', 'Floor', 'Required']}
      size="small"
    >
      {requirement.map((r) => (
        <TableRow key={`${r.date}|${r.shiftTypeId}|${r.skillId}`}>
          <TableCell>{formatDay(r.date)}</TableCell>
          <TableCell>{shiftName(r.shiftTypeId)}</TableCell>
          <TableCell>{skillName(r.skillId)}</TableCell>
          <TableCell>{`${r.patients.low} / ${r.patients.medium} / ${r.patients.high}`}</TableCell>
          <TableCell>{r.byRatio}</TableCell>
          <TableCell>{r.floor}</TableCell>
          <TableCell>{r.required}</TableCell>
        </TableRow>
      ))}
    </DataTable>
  );
}
