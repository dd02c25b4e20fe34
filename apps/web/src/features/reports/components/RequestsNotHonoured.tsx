import {
  makeStyles,
  Subtitle1,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { RequestNotHonouredDto } from '@rotaplex/contracts';
import { formatDate } from '../utils/reportFigures';

const useStyles = makeStyles({
  root: {
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusLarge,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalL,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    overflowX: 'auto',
  },
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
    <section className={styles.root} aria-labelledby="requests-not-honoured">
      <Subtitle1 as="h2" id="requests-not-honoured">
        Requests honoured
      </Subtitle1>
      <span className={styles.muted}>
        {requests === 0
          ? 'Nobody asked for anything in this period.'
          : `${honoured} of ${requests} requests are honoured${items.length ? '; the others and why:' : '.'}`}
      </span>
      {items.length > 0 && (
        <Table size="small" aria-label="Requests not honoured">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Person</TableHeaderCell>
              <TableHeaderCell>Date</TableHeaderCell>
              <TableHeaderCell>Request</TableHeaderCell>
              <TableHeaderCell>Why not</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
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
          </TableBody>
        </Table>
      )}
    </section>
  );
}
