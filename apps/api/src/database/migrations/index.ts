import { InitialSchema1764633600000 } from './1764633600000-initial-schema';
import { PlanningData1764720000000 } from './1764720000000-planning-data';
import { Solving1764806400000 } from './1764806400000-solving';
import { Publishing1764892800000 } from './1764892800000-publishing';
import { Requests1764979200000 } from './1764979200000-requests';
import { CalendarFeed1765065600000 } from './1765065600000-calendar-feed';
import { Swaps1765152000000 } from './1765152000000-swaps';
import { SwapFirstDate1765281600000 } from './1765281600000-swap-first-date';
import { OutboxSealedBody1765368000000 } from './1765368000000-outbox-sealed-body';
import { SolveRunMode1765454400000 } from './1765454400000-solve-run-mode';
import { RosterPeriodChanges1765540800000 } from './1765540800000-roster-period-changes';
import { UnitPublishLead1765713600000 } from './1765713600000-unit-publish-lead';
import { Demand1765800000000 } from './1765800000000-demand';
import { NoticeWindow1765972800000 } from './1765972800000-notice-window';
import { OpenShiftOutsideOffers1765886400000 } from './1765886400000-open-shift-outside-offers';
import { RegisteredSkills1766059200000 } from './1766059200000-registered-skills';

/** Migrations in the order they run. Add new ones at the end; never edit one that has shipped. */
export const MIGRATIONS = [
  InitialSchema1764633600000,
  PlanningData1764720000000,
  Solving1764806400000,
  Publishing1764892800000,
  Requests1764979200000,
  CalendarFeed1765065600000,
  Swaps1765152000000,
  SwapFirstDate1765281600000,
  OutboxSealedBody1765368000000,
  SolveRunMode1765454400000,
  RosterPeriodChanges1765540800000,
  UnitPublishLead1765713600000,
  Demand1765800000000,
  OpenShiftOutsideOffers1765886400000,
  NoticeWindow1765972800000,
  RegisteredSkills1766059200000,
];
