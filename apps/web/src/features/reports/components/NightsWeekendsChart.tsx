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
import { ChartSection } from './ChartSection';
import { CHART_COLOURS, legendText, rowsHeight } from './chartTheme';

function spread(values: number[]): string {
  if (!values.length) return 'nobody';
  return `from ${Math.min(...values)} to ${Math.max(...values)}`;
}

/** Night shifts and weekends worked per person (bar chart): how evenly the unsocial hours fall. */
export function NightsWeekendsChart({ people }: { people: PersonReportDto[] }) {
  const rows = people.map((p) => ({ name: p.name, nights: p.nights, weekends: p.weekendsWorked }));
  return (
    <ChartSection
      title="Nights and weekends per person"
      summary={`Night shifts per person range ${spread(people.map((p) => p.nights))}; weekends worked ${spread(people.map((p) => p.weekendsWorked))}.`}
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
          <XAxis type="number" allowDecimals={false} stroke={CHART_COLOURS.text} />
          <YAxis type="category" dataKey="name" width={140} interval={0} stroke={CHART_COLOURS.text} />
          <Tooltip />
          <Legend formatter={legendText} />
          <Bar dataKey="nights" name="Night shifts" fill={CHART_COLOURS.nights} isAnimationActive={false} />
          <Bar
            dataKey="weekends"
            name="Weekends worked"
            fill={CHART_COLOURS.weekends}
            isAnimationActive={false}
          />
        </BarChart>
      }
      table={
        <Table size="small" aria-label="Nights and weekends per person">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Person</TableHeaderCell>
              <TableHeaderCell>Night shifts</TableHeaderCell>
              <TableHeaderCell>Weekends worked</TableHeaderCell>
              <TableHeaderCell>Weekend days worked</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {people.map((p) => (
              <TableRow key={p.staffMemberId}>
                <TableCell>{p.name}</TableCell>
                <TableCell>{p.nights}</TableCell>
                <TableCell>{p.weekendsWorked}</TableCell>
                <TableCell>{p.weekendDaysWorked}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      }
    />
  );
}
