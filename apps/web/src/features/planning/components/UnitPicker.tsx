import { Field, makeStyles, Select } from '@fluentui/react-components';
import type { UnitDto } from '@rotaplex/contracts';

const useStyles = makeStyles({ root: { minWidth: '16rem' } });

export interface UnitPickerProps {
  units: readonly UnitDto[];
  value: string;
  onChange: (unitId: string) => void;
}

/** Chooses the unit a planning screen shows. */
export function UnitPicker({ units, value, onChange }: UnitPickerProps) {
  const styles = useStyles();
  return (
    <Field label="Unit" className={styles.root}>
      <Select value={value} onChange={(_, d) => onChange(d.value)}>
        {units.map((u) => (
          <option key={u.id} value={u.id}>
            {u.name}
          </option>
        ))}
      </Select>
    </Field>
  );
}
