import { Body1, makeStyles, Subtitle2, tokens } from '@fluentui/react-components';
import { ChevronRightRegular } from '@fluentui/react-icons';
import type { Permission } from '@rotaplex/contracts';
import { useLinkClickHandler, useHref } from 'react-router-dom';
import { navItemsFor, type NavItem } from '@/features/navigation/navItems';

const useStyles = makeStyles({
  list: {
    listStyleType: 'none',
    margin: 0,
    padding: 0,
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(16rem, 1fr))',
    gap: tokens.spacingHorizontalM,
  },
  card: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    height: '100%',
    boxSizing: 'border-box',
    padding: tokens.spacingHorizontalL,
    borderRadius: tokens.borderRadiusLarge,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    backgroundColor: tokens.colorNeutralBackground1,
    color: tokens.colorNeutralForeground1,
    textDecorationLine: 'none',
    ':hover': {
      border: `${tokens.strokeWidthThin} solid ${tokens.colorBrandStroke1}`,
      backgroundColor: tokens.colorBrandBackground2,
    },
    ':focus-visible': { outline: `${tokens.strokeWidthThick} solid ${tokens.colorStrokeFocus2}` },
  },
  text: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXXS, flexGrow: 1 },
  muted: { color: tokens.colorNeutralForeground3 },
  chevron: { color: tokens.colorBrandForeground1, fontSize: tokens.fontSizeBase500, display: 'flex' },
});

function StepCard({ item }: { item: NavItem }) {
  const styles = useStyles();
  const href = useHref(item.path);
  const handleClick = useLinkClickHandler<HTMLAnchorElement>(item.path);
  return (
    <a className={styles.card} href={href} onClick={handleClick}>
      <span className={styles.text}>
        <Subtitle2>{item.label}</Subtitle2>
        <Body1 className={styles.muted}>{item.description}</Body1>
      </span>
      <span className={styles.chevron} aria-hidden="true">
        <ChevronRightRegular />
      </span>
    </a>
  );
}

/** The pages this person can use, each with a line on what it is for. */
export function NextSteps({ permissions }: { permissions: readonly Permission[] }) {
  const styles = useStyles();
  const items = navItemsFor(permissions).filter((item) => item.key !== 'home');
  return (
    <ul className={styles.list}>
      {items.map((item) => (
        <li key={item.key}>
          <StepCard item={item} />
        </li>
      ))}
    </ul>
  );
}
