import type { ReactElement } from 'react';
import { Caption1Strong, makeStyles, mergeClasses, tokens } from '@fluentui/react-components';
import {
  ArrowSwapRegular,
  CalendarAddRegular,
  CalendarClockRegular,
  CalendarEditRegular,
  TaskListSquareLtrRegular,
  CheckmarkCircleRegular,
  BuildingRegular,
  CalendarPersonRegular,
  CalendarLtrRegular,
  ClockRegular,
  DocumentBulletListRegular,
  PeopleRegular,
  RibbonRegular,
  TableRegular,
  HomeRegular,
  MailInboxRegular,
  MailArrowUpRegular,
  PeopleTeamRegular,
  PersonCircleRegular,
  GridRegular,
  DataLineRegular,
} from '@fluentui/react-icons';
import type { Permission } from '@rotaplex/contracts';
import { NavLink } from 'react-router-dom';
import { navSectionsFor, type NavKey } from '@/features/navigation/navItems';

const ICONS: Record<NavKey, ReactElement> = {
  home: <HomeRegular />,
  users: <PeopleTeamRegular />,
  units: <GridRegular />,
  organisation: <BuildingRegular />,
  mailbox: <MailInboxRegular />,
  outbox: <MailArrowUpRegular />,
  profile: <PersonCircleRegular />,
  myRoster: <CalendarPersonRegular />,
  swaps: <ArrowSwapRegular />,
  openShifts: <CalendarAddRegular />,
  swapApprovals: <CheckmarkCircleRegular />,
  myAvailability: <CalendarClockRegular />,
  myRequests: <CalendarEditRegular />,
  requests: <TaskListSquareLtrRegular />,
  rosterPeriods: <CalendarLtrRegular />,
  coverNeeds: <TableRegular />,
  demand: <DataLineRegular />,
  staff: <PeopleRegular />,
  shiftTypes: <ClockRegular />,
  contracts: <DocumentBulletListRegular />,
  skills: <RibbonRegular />,
};

const useStyles = makeStyles({
  root: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalL,
    padding: `${tokens.spacingVerticalL} ${tokens.spacingHorizontalS}`,
  },
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXXS },
  heading: {
    color: tokens.colorNeutralForeground3,
    textTransform: 'uppercase',
    letterSpacing: '0.06em',
    padding: `0 ${tokens.spacingHorizontalM} ${tokens.spacingVerticalXS}`,
  },
  list: {
    listStyleType: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXXS,
  },
  link: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    borderRadius: tokens.borderRadiusMedium,
    color: tokens.colorNeutralForeground2,
    textDecorationLine: 'none',
    fontSize: tokens.fontSizeBase300,
    lineHeight: tokens.lineHeightBase300,
    position: 'relative',
    ':hover': { backgroundColor: tokens.colorNeutralBackground1Hover, color: tokens.colorNeutralForeground1 },
    ':focus-visible': {
      outline: `${tokens.strokeWidthThick} solid ${tokens.colorStrokeFocus2}`,
      outlineOffset: `calc(${tokens.strokeWidthThin} * -1)`,
    },
  },
  active: {
    backgroundColor: tokens.colorBrandBackground2,
    color: tokens.colorBrandForeground2,
    fontWeight: tokens.fontWeightSemibold,
    ':hover': {
      backgroundColor: tokens.colorBrandBackground2Hover,
      color: tokens.colorBrandForeground2Hover,
    },
    '::before': {
      content: '""',
      position: 'absolute',
      left: 0,
      top: tokens.spacingVerticalS,
      bottom: tokens.spacingVerticalS,
      width: tokens.strokeWidthThicker,
      borderRadius: tokens.borderRadiusCircular,
      backgroundColor: tokens.colorBrandStroke1,
    },
  },
  icon: { fontSize: tokens.fontSizeBase500, display: 'flex' },
});

export interface SideNavProps {
  permissions: readonly Permission[];
}

/** The main navigation. Items appear only when the user's role grants their permission. */
export function SideNav({ permissions }: SideNavProps) {
  const styles = useStyles();
  return (
    <nav aria-label="Main" className={styles.root}>
      {navSectionsFor(permissions).map((group) => (
        <div key={group.section} className={styles.section}>
          <Caption1Strong as="h2" className={styles.heading} id={`nav-${group.section}`}>
            {group.title}
          </Caption1Strong>
          <ul className={styles.list} aria-labelledby={`nav-${group.section}`}>
            {group.items.map((item) => (
              <li key={item.key}>
                <NavLink
                  to={item.path}
                  end={item.key === 'home'}
                  className={({ isActive }) => mergeClasses(styles.link, isActive && styles.active)}
                >
                  <span className={styles.icon} aria-hidden="true">
                    {ICONS[item.key]}
                  </span>
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </div>
      ))}
    </nav>
  );
}
