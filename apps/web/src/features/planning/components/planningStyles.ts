import { makeStyles, tokens } from '@fluentui/react-components';

/** Layout shared by the planning set-up pages. */
export const usePlanningStyles = makeStyles({
  panel: {
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusLarge,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalL,
    overflowX: 'auto',
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
  },
  toolbar: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'flex-end',
    gap: tokens.spacingHorizontalM,
    marginBottom: tokens.spacingVerticalM,
  },
  grow: { flexGrow: 1 },
  muted: { color: tokens.colorNeutralForeground3 },
  actionsCol: { width: '3.5rem' },
  nowrap: { whiteSpace: 'nowrap' },
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
});
