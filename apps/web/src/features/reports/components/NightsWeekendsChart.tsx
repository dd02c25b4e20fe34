import { TableCell, TableRow } from '@fluentui/react-components';
import type { PersonReportDto } from '@rotaplex/contracts';
import { DataTable } from '@/ui/DataTable';
import { ChartSection } from './ChartSection';
import { CHART_COLOURS } from './chartTheme';
import { ReportBarChart } from './ReportBarChart';

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
        <ReportBarChart
          rows={rows}
          by="people"
          valueAxis={{ allowDecimals: false }}
          bars={[
            { dataKey: 'nights', name: 'Night shifts', fill: CHART_COLOURS.nights },
            { dataKey: 'weekends', name: 'Weekends worked', fill: CHART_COLOURS.weekends },
          ]}
        />
      }
      table={
        <DataTable
          label="Nights and weekends per person"
          columns={['Person', 'Night shifts', 'Weekends worked', 'Weekend days worked']}
          size="small"
        >
          {people.map((p) => (
            <TableRow key={p.staffMemberId}>
              <TableCell>{p.name}</TableCell>
              <TableCell>{p.nights}</TableCell>
              <TableCell>{p.weekendsWorked}</TableCell>
              <TableCell>{p.weekendDaysWorked}</TableCell>
            </TableRow>
          ))}
        </DataTable>
      }
    />
  );
}
