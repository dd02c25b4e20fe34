import {
  Badge,
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
} from '@fluentui/react-components';
import type { MyRosterShiftDto } from '@rotaplex/contracts';
import { useSurfaceStyles } from '@/ui/surfaceStyles';
import { wallClock } from '../utils/rosterEvents';

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
  const surface = useSurfaceStyles();
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
            <dl className={surface.facts}>
              <dt className={surface.term}>Who</dt>
              <dd className={surface.detail}>{shift.mine ? `You (${shift.name})` : shift.name}</dd>
              <dt className={surface.term}>Shift</dt>
              <dd className={surface.detail}>
                {shift.shiftName} ({shift.shiftCode})
              </dd>
              <dt className={surface.term}>Starts</dt>
              <dd className={surface.detail}>{formatWallClock(start)}</dd>
              <dt className={surface.term}>Ends</dt>
              <dd className={surface.detail}>{formatWallClock(end)}</dd>
              <dt className={surface.term}>Length</dt>
              <dd className={surface.detail}>{Number.isInteger(hours) ? hours : hours.toFixed(1)} hours</dd>
              <dt className={surface.term}>Unit</dt>
              <dd className={surface.detail}>{shift.unitName}</dd>
              <dt className={surface.term}>Time zone</dt>
              <dd className={surface.detail}>{shift.timeZone}</dd>
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
