import { useState } from 'react';
import { Input, makeStyles } from '@fluentui/react-components';

const useStyles = makeStyles({ input: { width: '5rem', minWidth: '4rem' } });

export interface NumberCellProps {
  label: string;
  value: number | undefined;
  min: number;
  max: number;
  /** Called with each valid number typed (an empty cell counts as 0 when `emptyIsZero`). */
  onChange: (value: number) => void;
  emptyIsZero?: boolean;
  /** An empty cell is allowed and means "none" (reported through this callback). */
  onEmpty?: () => void;
  step?: number;
}

/** A number input that keeps what is typed (e.g. "2.") and reports only valid numbers within the range. */
export function NumberCell({
  label,
  value,
  min,
  max,
  onChange,
  emptyIsZero = true,
  onEmpty,
  step = 1,
}: NumberCellProps) {
  const styles = useStyles();
  const [text, setText] = useState(value === undefined ? '' : String(value));
  const n = text.trim() === '' && emptyIsZero ? 0 : Number(text);
  const invalid = text.trim() === '' ? !emptyIsZero && !onEmpty : !Number.isFinite(n) || n < min || n > max;
  return (
    <Input
      className={styles.input}
      size="small"
      type="number"
      inputMode="decimal"
      min={min}
      max={max}
      step={step}
      aria-label={label}
      aria-invalid={invalid || undefined}
      value={text}
      onChange={(_, d) => {
        setText(d.value);
        if (d.value.trim() === '' && !emptyIsZero && onEmpty) return onEmpty();
        const v = d.value.trim() === '' && emptyIsZero ? 0 : Number(d.value);
        if (d.value.trim() !== '' || emptyIsZero) if (Number.isFinite(v) && v >= min && v <= max) onChange(v);
      }}
    />
  );
}
