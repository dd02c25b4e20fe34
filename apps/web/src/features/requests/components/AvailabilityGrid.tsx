import { useEffect, useState } from 'react';
import {
  Button,
  Field,
  makeStyles,
  mergeClasses,
  Select,
  Subtitle2,
  TableCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import {
  AVAILABILITY_STATUSES,
  type AvailabilityStatus,
  DAY_PART_LABELS,
  DAY_PARTS,
} from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMediaQuery } from '@/hooks/useMediaQuery';
import { DataTable } from '@/ui/DataTable';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { availabilityQuery, requestKeys, saveAvailability } from '../api/requests.queries';
import {
  AVAILABILITY_LABELS,
  type AvailabilityGridState,
  cellKey,
  cellsFromGrid,
  GRID_WEEKDAYS,
  gridFromCells,
  WEEKDAY_LABELS,
} from '../utils/requestText';

const useStyles = makeStyles({
  wrap: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, overflowX: 'auto' },
  select: { minWidth: '8.5rem' },
  prefer: { backgroundColor: tokens.colorPaletteYellowBackground1 },
  unavailable: { backgroundColor: tokens.colorPaletteRedBackground1 },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
  days: { listStyleType: 'none', margin: 0, padding: 0, display: 'grid', gap: tokens.spacingVerticalM },
  day: {
    display: 'grid',
    gap: tokens.spacingVerticalS,
    padding: tokens.spacingHorizontalM,
    borderRadius: tokens.borderRadiusMedium,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  field: { padding: tokens.spacingHorizontalXS, borderRadius: tokens.borderRadiusMedium },
});

/** The weekly grid of one staff member: a part of the day per row, a weekday per column. */
export function AvailabilityGrid({ staffMemberId }: { staffMemberId: string }) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const stored = useQuery(availabilityQuery(staffMemberId));
  // On a phone each weekday is a block of its own with one labelled drop-down per part of the day.
  const narrow = useMediaQuery('(max-width: 720px)');
  const [grid, setGrid] = useState<AvailabilityGridState | null>(null);
  useEffect(() => {
    if (stored.data) setGrid(gridFromCells(stored.data.cells));
  }, [stored.data]);
  const save = useMutation({
    mutationFn: (g: AvailabilityGridState) => saveAvailability(staffMemberId, { cells: cellsFromGrid(g) }),
    onSuccess: (saved) => {
      queryClient.setQueryData(requestKeys.availability(staffMemberId), saved);
      notify('Availability saved', 'success');
    },
  });

  if (stored.error) return <ErrorBanner error={stored.error} onRetry={() => void stored.refetch()} />;
  if (!grid) return <TableSkeleton label="Loading availability" />;
  const set = (key: string, status: AvailabilityStatus) => setGrid({ ...grid, [key]: status });
  const tint = (status: AvailabilityStatus) =>
    status === 'unavailable' ? styles.unavailable : status === 'prefer-not' ? styles.prefer : undefined;
  const options = AVAILABILITY_STATUSES.map((s) => (
    <option key={s} value={s}>
      {AVAILABILITY_LABELS[s]}
    </option>
  ));

  return (
    <div className={styles.wrap}>
      {narrow ? (
        <ul className={styles.days} aria-label="Weekly availability">
          {GRID_WEEKDAYS.map((w) => (
            <li key={w} className={styles.day}>
              <Subtitle2 as="h3">{WEEKDAY_LABELS[w]}</Subtitle2>
              {DAY_PARTS.map((part) => {
                const key = cellKey(w, part);
                return (
                  <Field
                    key={part}
                    label={DAY_PART_LABELS[part]}
                    className={mergeClasses(styles.field, tint(grid[key]))}
                  >
                    <Select
                      aria-label={`${WEEKDAY_LABELS[w]}, ${part}`}
                      value={grid[key]}
                      onChange={(_, d) => set(key, d.value as AvailabilityStatus)}
                    >
                      {options}
                    </Select>
                  </Field>
                );
              })}
            </li>
          ))}
        </ul>
      ) : (
        <DataTable
          label="Weekly availability"
          columns={['Part of the day', ...GRID_WEEKDAYS.map((w) => WEEKDAY_LABELS[w])]}
          size="small"
        >
          {DAY_PARTS.map((part) => (
            <TableRow key={part}>
              <TableCell>{DAY_PART_LABELS[part]}</TableCell>
              {GRID_WEEKDAYS.map((w) => {
                const key = cellKey(w, part);
                const status = grid[key];
                return (
                  <TableCell
                    key={w}
                    className={
                      status === 'unavailable'
                        ? styles.unavailable
                        : status === 'prefer-not'
                          ? styles.prefer
                          : undefined
                    }
                  >
                    <Select
                      className={styles.select}
                      aria-label={`${WEEKDAY_LABELS[w]}, ${part}`}
                      value={status}
                      onChange={(_, d) => set(key, d.value as AvailabilityStatus)}
                    >
                      {AVAILABILITY_STATUSES.map((s) => (
                        <option key={s} value={s}>
                          {AVAILABILITY_LABELS[s]}
                        </option>
                      ))}
                    </Select>
                  </TableCell>
                );
              })}
            </TableRow>
          ))}
        </DataTable>
      )}
      {save.error ? <ErrorBanner error={save.error} title="Your availability was not saved" /> : null}
      <div className={styles.actions}>
        <Button appearance="primary" disabled={save.isPending} onClick={() => save.mutate(grid)}>
          Save availability
        </Button>
        <Button
          disabled={save.isPending || !stored.data}
          onClick={() => stored.data && setGrid(gridFromCells(stored.data.cells))}
        >
          Undo changes
        </Button>
      </div>
    </div>
  );
}
