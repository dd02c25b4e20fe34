import {
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
} from '@fluentui/react-components';
import type { PersonReportDto } from '@rotaplex/contracts';
import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis } from 'recharts';
import { formatHours, hoursRows, hoursStatus, HOURS_STATUS_TEXT } from '../utils/reportFigures';
import { ChartSection } from './ChartSection';
import { CHART_COLOURS, legendText, rowsHeight } from './chartTheme';

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
        <BarChart
          data={rows}
          layout="vertical"
          responsive
          accessibilityLayer={false}
          style={{ width: '100%', height: rowsHeight(rows.length) }}
          margin={{ left: 8, right: 16 }}
        >
          <CartesianGrid stroke={CHART_COLOURS.grid} horizontal={false} />
          <XAxis type="number" unit=" h" stroke={CHART_COLOURS.text} />
          <YAxis type="category" dataKey="name" width={140} interval={0} stroke={CHART_COLOURS.text} />
          <Tooltip />
          <Legend formatter={legendText} />
          <Bar dataKey="worked" name="Paid hours" fill={CHART_COLOURS.worked} isAnimationActive={false} />
          <Bar
            dataKey="target"
            name="Contracted hours"
            fill={CHART_COLOURS.target}
            isAnimationActive={false}
          />
        </BarChart>
      }
      table={
        <Table size="small" aria-label="Hours against contract">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Person</TableHeaderCell>
              <TableHeaderCell>Shifts</TableHeaderCell>
              <TableHeaderCell>Paid hours</TableHeaderCell>
              <TableHeaderCell>Minimum</TableHeaderCell>
              <TableHeaderCell>Contracted</TableHeaderCell>
              <TableHeaderCell>Maximum</TableHeaderCell>
              <TableHeaderCell>Difference</TableHeaderCell>
              <TableHeaderCell>Standing</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
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
          </TableBody>
        </Table>
      }
    />
  );
}
