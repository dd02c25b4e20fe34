import { TableCell, TableRow } from '@fluentui/react-components';
import type { CoverDayReportDto, CoverReportRowDto } from '@rotaplex/contracts';
import { DataTable } from '@/ui/DataTable';
import { coverDayRows, formatDate } from '../utils/reportFigures';
import { ChartSection } from './ChartSection';
import { CHART_COLOURS } from './chartTheme';
import { ReportBarChart } from './ReportBarChart';

export interface CoverChartProps {
  days: CoverDayReportDto[];
  cover: CoverReportRowDto[];
}

/** Cover needs of each day met at the target, at the minimum only, or short (stacked bars). */
export function CoverChart({ days, cover }: CoverChartProps) {
  const rows = coverDayRows(days);
  const needs = rows.reduce((s, r) => s + r.needs, 0);
  const short = rows.reduce((s, r) => s + r.belowMin, 0);
  const daysShort = rows.filter((r) => r.belowMin > 0).length;
  return (
    <ChartSection
      title="Cover met per day"
      summary={`${needs - short} of ${needs} cover needs have at least their minimum; ${daysShort} of ${rows.length} days have a need below its minimum.`}
      chart={
        <ReportBarChart
          rows={rows}
          by="days"
          valueAxis={{ allowDecimals: false }}
          bars={[
            { dataKey: 'metTarget', name: 'Target met', fill: CHART_COLOURS.metTarget },
            { dataKey: 'metMinOnly', name: 'Minimum met', fill: CHART_COLOURS.metMin },
            { dataKey: 'belowMin', name: 'Below minimum', fill: CHART_COLOURS.belowMin },
          ]}
        />
      }
      table={
        <DataTable
          label="Cover against needs"
          columns={[
            'Date',
            'Shift',
            'Skill',
            'Minimum',
            'Target',
            'On shift',
            'Short of minimum',
            'Short of target',
            'Over target',
          ]}
          size="small"
        >
          {cover.map((c) => (
            <TableRow key={`${c.date}|${c.shiftTypeId}|${c.skillId ?? ''}`}>
              <TableCell>{formatDate(c.date)}</TableCell>
              <TableCell>{c.shiftCode}</TableCell>
              <TableCell>{c.skillCode ?? 'Anyone'}</TableCell>
              <TableCell>{c.min}</TableCell>
              <TableCell>{c.target}</TableCell>
              <TableCell>{c.assigned}</TableCell>
              <TableCell>{c.shortOfMin}</TableCell>
              <TableCell>{c.shortOfTarget}</TableCell>
              <TableCell>{c.over}</TableCell>
            </TableRow>
          ))}
        </DataTable>
      }
    />
  );
}
