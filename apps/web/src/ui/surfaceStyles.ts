import { makeStyles, tokens } from '@fluentui/react-components';

/** Shared surfaces: a white card panel, and a two-column list of facts (`dl` with `dt`/`dd`). */
export const useSurfaceStyles = makeStyles({
  panel: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusLarge,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalXL,
  },
  facts: {
    display: 'grid',
    gridTemplateColumns: 'max-content 1fr',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalS,
    margin: 0,
  },
  term: { color: tokens.colorNeutralForeground3 },
  detail: { margin: 0 },
});
