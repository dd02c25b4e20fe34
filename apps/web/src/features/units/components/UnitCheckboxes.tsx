import { Caption1, Checkbox, makeStyles, tokens } from '@fluentui/react-components';
import type { UnitDto } from '@rotaplex/contracts';

const useStyles = makeStyles({
  fieldset: {
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusMedium,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    margin: 0,
    display: 'flex',
    flexDirection: 'column',
  },
  legend: {
    padding: `0 ${tokens.spacingHorizontalXS}`,
    fontWeight: tokens.fontWeightSemibold,
    fontSize: tokens.fontSizeBase300,
  },
  hint: { color: tokens.colorNeutralForeground3 },
  error: { color: tokens.colorPaletteRedForeground1 },
});

export interface UnitCheckboxesProps {
  units: readonly UnitDto[];
  value: readonly string[];
  onChange: (ids: string[]) => void;
  legend?: string;
  hint?: string;
  error?: string;
}

/** Picks any number of units; a fieldset, so screen readers announce the group with each box. */
export function UnitCheckboxes({
  units,
  value,
  onChange,
  legend = 'Units',
  hint,
  error,
}: UnitCheckboxesProps) {
  const styles = useStyles();
  const toggle = (id: string, checked: boolean) =>
    onChange(checked ? [...value, id] : value.filter((existing) => existing !== id));
  return (
    <fieldset className={styles.fieldset}>
      <legend className={styles.legend}>{legend}</legend>
      {units.length === 0 && (
        <Caption1 className={styles.hint}>No units yet. Create one under Units first.</Caption1>
      )}
      {units.map((unit) => (
        <Checkbox
          key={unit.id}
          label={unit.name}
          checked={value.includes(unit.id)}
          onChange={(_, data) => toggle(unit.id, data.checked === true)}
        />
      ))}
      {hint && <Caption1 className={styles.hint}>{hint}</Caption1>}
      {error && (
        <Caption1 className={styles.error} role="alert">
          {error}
        </Caption1>
      )}
    </fieldset>
  );
}
