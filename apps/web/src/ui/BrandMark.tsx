import { makeStyles, mergeClasses, tokens } from '@fluentui/react-components';

const useStyles = makeStyles({
  root: { width: '1.75em', height: '1.75em', flexShrink: 0, display: 'block' },
  tile: { fill: tokens.colorNeutralForegroundOnBrand, opacity: 0.35 },
  shift: { fill: tokens.colorPaletteMarigoldBackground3 },
  frame: { fill: 'none', stroke: tokens.colorNeutralForegroundOnBrand, strokeWidth: 1.5, opacity: 0.6 },
});

// A three-by-three roster grid with one shift per row: the Rotaplex mark.
const CELLS: [number, number, boolean][] = [
  [0, 0, true],
  [1, 0, false],
  [2, 0, false],
  [0, 1, false],
  [1, 1, true],
  [2, 1, false],
  [0, 2, false],
  [1, 2, false],
  [2, 2, true],
];

export function BrandMark({ className }: { className?: string }) {
  const styles = useStyles();
  return (
    <svg
      className={mergeClasses(styles.root, className)}
      viewBox="0 0 28 28"
      aria-hidden="true"
      focusable="false"
    >
      <rect className={styles.frame} x="1" y="1" width="26" height="26" rx="6" />
      {CELLS.map(([col, row, filled]) => (
        <rect
          key={`${col}-${row}`}
          className={filled ? styles.shift : styles.tile}
          x={5 + col * 6.5}
          y={5 + row * 6.5}
          width="5"
          height="5"
          rx="1.2"
        />
      ))}
    </svg>
  );
}
