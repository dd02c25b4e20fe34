import { useState } from 'react';
import {
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  MessageBar,
  MessageBarBody,
  Select,
} from '@fluentui/react-components';
import { PinOffRegular, PinRegular } from '@fluentui/react-icons';
import type { AssignmentCellDto, RosterViolationDto, ShiftTypeDto } from '@rotaplex/contracts';
import { errorText } from '@/api/errors';
import { formatDay } from '../utils/days';
import { ViolationList } from './ViolationsPanel';

export interface CellDialogProps {
  name: string;
  date: string;
  cell: AssignmentCellDto;
  shiftTypes: ShiftTypeDto[];
  /** The checker's findings for this person that include this date. */
  violations: RosterViolationDto[];
  onSave: (shiftTypeId: string | null) => Promise<unknown>;
  onPin: (pinned: boolean) => Promise<unknown>;
  onClose: () => void;
  /** Shows the cell without Save or Pin (a published period, or while the solver works), saying why. */
  readOnly?: string | null;
}

const OFF = '';

/** Changes one cell of the board; the checker's findings for the cell show at once after a change. */
export function CellDialog({
  name,
  date,
  cell,
  shiftTypes,
  violations,
  onSave,
  onPin,
  onClose,
  readOnly = null,
}: CellDialogProps) {
  const [value, setValue] = useState(cell.shiftTypeId ?? OFF);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const run = (action: () => Promise<unknown>) => {
    setBusy(true);
    setError(null);
    action()
      .catch((e: unknown) => setError(errorText(e)))
      .finally(() => setBusy(false));
  };
  const changed = value !== (cell.shiftTypeId ?? OFF);
  return (
    <Dialog open onOpenChange={(_, d) => !d.open && onClose()}>
      <DialogSurface>
        <DialogBody>
          <DialogTitle>
            {name}, {formatDay(date)}
          </DialogTitle>
          <DialogContent>
            <Field label="Shift">
              <Select
                value={value}
                onChange={(_, d) => setValue(d.value)}
                disabled={busy || readOnly !== null}
              >
                <option value={OFF}>Day off</option>
                {shiftTypes.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.code} · {s.name} ({s.start}–{s.end})
                  </option>
                ))}
              </Select>
            </Field>
            <p>
              {cell.pinned
                ? 'Pinned: a new Generate keeps this cell as it is.'
                : 'Not pinned: a new Generate may change this cell.'}
            </p>
            {readOnly && (
              <MessageBar intent="info">
                <MessageBarBody>{readOnly}</MessageBarBody>
              </MessageBar>
            )}
            {error && (
              <MessageBar intent="error">
                <MessageBarBody>{error}</MessageBarBody>
              </MessageBar>
            )}
            {violations.length > 0 ? (
              <ViolationList violations={violations} label="Rule findings for this cell" />
            ) : (
              <p>No rule findings for this cell.</p>
            )}
          </DialogContent>
          <DialogActions>
            {readOnly === null && (
              <>
                <Button
                  icon={cell.pinned ? <PinOffRegular /> : <PinRegular />}
                  disabled={busy}
                  onClick={() => run(() => onPin(!cell.pinned))}
                >
                  {cell.pinned ? 'Unpin' : 'Pin'}
                </Button>
                <Button
                  appearance="primary"
                  disabled={busy || !changed}
                  onClick={() => run(() => onSave(value || null))}
                >
                  Save shift
                </Button>
              </>
            )}
            <Button onClick={onClose}>Close</Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
