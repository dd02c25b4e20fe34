import type { ReactNode } from 'react';
import { Body1, makeStyles, Subtitle2, tokens } from '@fluentui/react-components';

const useStyles = makeStyles({
  root: {
    display: 'flex',
    flexDirection: 'column',
    alignItems: 'center',
    textAlign: 'center',
    gap: tokens.spacingVerticalS,
    padding: `${tokens.spacingVerticalXXXL} ${tokens.spacingHorizontalXL}`,
    border: `${tokens.strokeWidthThin} dashed ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground2,
  },
  icon: { fontSize: tokens.fontSizeHero800, color: tokens.colorBrandForeground2, display: 'flex' },
  text: { color: tokens.colorNeutralForeground3, maxWidth: '48ch' },
});

export interface EmptyStateProps {
  icon?: ReactNode;
  title: string;
  children?: ReactNode;
  action?: ReactNode;
  /** Use 'h1' when the empty state is the whole page. */
  headingLevel?: 'h1' | 'h2' | 'h3';
}

/** Shown instead of a list that has nothing in it, saying why and what to do next. */
export function EmptyState({ icon, title, children, action, headingLevel = 'h2' }: EmptyStateProps) {
  const styles = useStyles();
  return (
    <div className={styles.root} role="status">
      {icon && <span className={styles.icon}>{icon}</span>}
      <Subtitle2 as={headingLevel}>{title}</Subtitle2>
      {children && <Body1 className={styles.text}>{children}</Body1>}
      {action}
    </div>
  );
}
