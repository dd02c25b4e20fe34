import {
  Badge,
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import type { MyRosterShiftDto } from '@rotaplex/contracts';
import { wallClock } from '../utils/rosterEvents';

const useStyles = makeStyles({
  meta: {
    display: 'grid',
    gridTemplateColumns: 'max-content 1fr',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalS,
    margin: 0,
  },
  term: { color: tokens.colorNeutralForeground3 },
  detail: { margin: 0 },
});

export interface ShiftDetailsDialogProps {
  shift: MyRosterShiftDto;
  onClose: () => void;
}

const DAY = new Intl.DateTimeFormat('en-GB', {
  weekday: 'long',
  day: 'numeric',
  month: 'long',
  year: 'numeric',
  timeZone: 'UTC',
});

/** "Saturday 30 March 2030, 22:00" from a wall-clock "YYYY-MM-DDTHH:mm:ss". */
function formatWallClock(local: string): string {
  return `${DAY.format(new Date(`${local.slice(0, 10)}T00:00:00Z`))}, ${local.slice(11, 16)}`;
}

/** The details of one shift of the calendar, in the unit's time zone. */
export function ShiftDetailsDialog({ shift, onClose }: ShiftDetailsDialogProps) {
  const styles = useStyles();
  const start = wallClock(shift.start, shift.timeZone);
  const end = wallClock(shift.end, shift.timeZone);
  const hours = (Date.parse(shift.end) - Date.parse(shift.start)) / 3_600_000;
  return (
    <Dialog open onOpenChange={(_, d) => !d.open && onClose()}>
      <DialogSurface aria-describedby={undefined}>
        <DialogBody>
          <DialogTitle>
            {shift.shiftName} shift{' '}
            {shift.mine && (
              <Badge appearance="tint" color="brand">
                Yours
              </Badge>
            )}
          </DialogTitle>
          <DialogContent>
            <dl className={styles.meta}>
              <dt className={styles.term}>Who</dt>
              <dd className={styles.detail}>{shift.mine ? `You (${shift.name})` : shift.name}</dd>
              <dt className={styles.term}>Shift</dt>
              <dd className={styles.detail}>
                {shift.shiftName} ({shift.shiftCode})
              </dd>
              <dt className={styles.term}>Starts</dt>
              <dd className={styles.detail}>{formatWallClock(start)}</dd>
              <dt className={styles.term}>Ends</dt>
              <dd className={styles.detail}>{formatWallClock(end)}</dd>
              <dt className={styles.term}>Length</dt>
              <dd className={styles.detail}>{Number.isInteger(hours) ? hours : hours.toFixed(1)} hours</dd>
              <dt className={styles.term}>Unit</dt>
              <dd className={styles.detail}>{shift.unitName}</dd>
              <dt className={styles.term}>Time zone</dt>
              <dd className={styles.detail}>{shift.timeZone}</dd>
            </dl>
          </DialogContent>
          <DialogActions>
            <Button appearance="primary" onClick={onClose}>
              Close
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
