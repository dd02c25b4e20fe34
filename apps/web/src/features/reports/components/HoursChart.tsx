import { TableCell, TableRow } from '@fluentui/react-components';
import type { PersonReportDto } from '@rotaplex/contracts';
import { DataTable } from '@/ui/DataTable';
import { formatHours, hoursRows, hoursStatus, HOURS_STATUS_TEXT } from '../utils/reportFigures';
import { ChartSection } from './ChartSection';
import { CHART_COLOURS } from './chartTheme';
import { ReportBarChart } from './ReportBarChart';

const hoursOrDash = (minutes: number | null) => (minutes === null ? '–' : formatHours(minutes));

/** Paid hours against contracted hours per person (bar chart), with the limits in the table. */
export function HoursChart({ people }: { people: PersonReportDto[] }) {
  const rows = hoursRows(people);
  const below = people.filter((p) => hoursStatus(p) === 'belowMin').length;
  const above = people.filter((p) => hoursStatus(p) === 'aboveMax').length;
  return (
    <ChartSection
      title="Hours against contract"
      summary={`Paid hours of each person beside their contracted hours for the period. ${below} below the contract minimum, ${above} above the maximum.`}
      chart={
        <ReportBarChart
          rows={rows}
          by="people"
          valueAxis={{ unit: ' h' }}
          bars={[
            { dataKey: 'worked', name: 'Paid hours', fill: CHART_COLOURS.worked },
            { dataKey: 'target', name: 'Contracted hours', fill: CHART_COLOURS.target },
          ]}
        />
      }
      table={
        <DataTable
          label="Hours against contract"
          columns={[
            'Person',
            'Shifts',
            'Paid hours',
            'Minimum',
            'Contracted',
            'Maximum',
            'Difference',
            'Standing',
          ]}
          size="small"
        >
          {people.map((p) => (
            <TableRow key={p.staffMemberId}>
              <TableCell>{p.name}</TableCell>
              <TableCell>{p.shifts}</TableCell>
              <TableCell>{formatHours(p.paidMinutes)}</TableCell>
              <TableCell>{hoursOrDash(p.minPaidMinutes)}</TableCell>
              <TableCell>{hoursOrDash(p.targetPaidMinutes)}</TableCell>
              <TableCell>{hoursOrDash(p.maxPaidMinutes)}</TableCell>
              <TableCell>
                {p.deviationMinutes === null
                  ? '–'
                  : `${p.deviationMinutes > 0 ? '+' : ''}${formatHours(p.deviationMinutes)}`}
              </TableCell>
              <TableCell>{HOURS_STATUS_TEXT[hoursStatus(p)]}</TableCell>
            </TableRow>
          ))}
        </DataTable>
      }
    />
  );
}
