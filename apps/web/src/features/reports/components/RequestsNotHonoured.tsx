import { makeStyles, TableCell, TableRow, tokens } from '@fluentui/react-components';
import type { RequestNotHonouredDto } from '@rotaplex/contracts';
import { DataTable } from '@/ui/DataTable';
import { formatDate } from '../utils/reportFigures';
import { ReportCard } from './ChartSection';

const useStyles = makeStyles({
  root: { overflowX: 'auto' },
  muted: { color: tokens.colorNeutralForeground3 },
  reasons: { margin: 0, paddingInlineStart: tokens.spacingHorizontalL },
});

const KIND: Record<string, string> = {
  dayOff: 'Day off',
  shiftOn: 'Shift wanted',
  shiftOff: 'Shift not wanted',
};

export interface RequestsNotHonouredProps {
  requests: number;
  honoured: number;
  items: RequestNotHonouredDto[];
}

/** Requests the roster does not honour, each with the checker's reasons. */
export function RequestsNotHonoured({ requests, honoured, items }: RequestsNotHonouredProps) {
  const styles = useStyles();
  return (
    <ReportCard title="Requests honoured" className={styles.root}>
      <span className={styles.muted}>
        {requests === 0
          ? 'Nobody asked for anything in this period.'
          : `${honoured} of ${requests} requests are honoured${items.length ? '; the others and why:' : '.'}`}
      </span>
      {items.length > 0 && (
        <DataTable
          label="Requests not honoured"
          columns={['Person', 'Date', 'Request', 'Why not']}
          size="small"
        >
          {items.map((r) => (
            <TableRow key={`${r.staffMemberId}|${r.date}|${r.kind}`}>
              <TableCell>{r.name}</TableCell>
              <TableCell>{formatDate(r.date)}</TableCell>
              <TableCell>{KIND[r.kind] ?? r.kind}</TableCell>
              <TableCell>
                <ul className={styles.reasons}>
                  {r.reasons.slice(1).map((reason) => (
                    <li key={reason}>{reason}</li>
                  ))}
                </ul>
              </TableCell>
            </TableRow>
          ))}
        </DataTable>
      )}
    </ReportCard>
  );
}
