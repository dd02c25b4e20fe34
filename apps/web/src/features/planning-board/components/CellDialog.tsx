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
  MessageBarTitle,
  Select,
  Textarea,
} from '@fluentui/react-components';
import { PinOffRegular, PinRegular } from '@fluentui/react-icons';
import {
  type AssignmentCellDto,
  GUARD_RAIL_DEFERRAL,
  OVERRIDE_REASON_MAX_LENGTH,
  type RosterViolationDto,
  type ShiftTypeDto,
} from '@rotaplex/contracts';
import { ApiRequestError, errorText } from '@/api/errors';
import { formatDay } from '../utils/days';
import { ViolationList } from './ViolationsPanel';

export interface CellDialogProps {
  name: string;
  date: string;
  cell: AssignmentCellDto;
  shiftTypes: ShiftTypeDto[];
  /** The checker's findings for this person that include this date. */
  violations: RosterViolationDto[];
  /** Saves the cell; `overrideReason` keeps an edit that breaks a rest or working-time rule. */
  onSave: (shiftTypeId: string | null, overrideReason?: string) => Promise<unknown>;
  onPin: (pinned: boolean) => Promise<unknown>;
  onClose: () => void;
  /** Shows the cell without Save or Pin (a published period, or while the solver works), saying why. */
  readOnly?: string | null;
}

const OFF = '';

/**
 * Changes one cell of the board; the checker's findings for the cell show at once after a change.
 * An edit the server refuses because it breaks a rest or working-time rule shows what it breaks and
 * the caution, and can be kept with a written reason (recorded in the audit trail).
 */
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
  /** The rules an edit would break, as the server words them, while it waits for a reason. */
  const [breaks, setBreaks] = useState<string[] | null>(null);
  const [reason, setReason] = useState('');
  const run = (action: () => Promise<unknown>) => {
    setBusy(true);
    setError(null);
    action()
      .then(() => setBreaks(null))
      .catch((e: unknown) => {
        if (
          e instanceof ApiRequestError &&
          e.status === 422 &&
          e.messages.some((m) => /overrideReason/.test(m))
        ) {
          setBreaks(e.messages.filter((m) => !/overrideReason/.test(m)));
        } else setError(errorText(e));
      })
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
                onChange={(_, d) => {
                  setValue(d.value);
                  setBreaks(null);
                }}
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
            {breaks && (
              <MessageBar intent="warning" layout="multiline">
                <MessageBarBody>
                  <MessageBarTitle>This edit breaks a rule of the contract</MessageBarTitle>
                  <ul aria-label="Rules this edit breaks">
                    {breaks.map((m) => (
                      <li key={m}>{m}</li>
                    ))}
                  </ul>
                  Short rest and long runs of work raise the risk of fatigue and mistakes.{' '}
                  {GUARD_RAIL_DEFERRAL} To keep the edit, say why; the reason goes into the audit trail.
                </MessageBarBody>
              </MessageBar>
            )}
            {breaks && (
              <Field label="Reason for keeping this edit" required>
                <Textarea
                  value={reason}
                  maxLength={OVERRIDE_REASON_MAX_LENGTH}
                  onChange={(_, d) => setReason(d.value)}
                  disabled={busy}
                />
              </Field>
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
                {breaks ? (
                  <Button
                    appearance="primary"
                    disabled={busy || reason.trim() === ''}
                    onClick={() => run(() => onSave(value || null, reason.trim()))}
                  >
                    Keep with this reason
                  </Button>
                ) : (
                  <Button
                    appearance="primary"
                    disabled={busy || !changed}
                    onClick={() => run(() => onSave(value || null))}
                  >
                    Save shift
                  </Button>
                )}
              </>
            )}
            <Button onClick={onClose}>Close</Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
