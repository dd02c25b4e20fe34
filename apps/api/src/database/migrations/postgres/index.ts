import { PostgresBaseline1765540800000 } from './1765540800000-postgres-baseline';
import { UnitPublishLead1765713600000 } from './1765713600000-unit-publish-lead';
import { Demand1765800000000 } from './1765800000000-demand';
import { OpenShiftOutsideOffers1765886400000 } from './1765886400000-open-shift-outside-offers';
import { NoticeWindow1765972800000 } from './1765972800000-notice-window';
import { RegisteredSkills1766059200000 } from './1766059200000-registered-skills';

/**
 * PostgreSQL's migrations, in the order they run, written by TypeORM's schema diff against a real
 * PostgreSQL (generate-postgres-migration.ts). The first one creates the whole schema as of
 * SQLite's RosterPeriodChanges1765540800000 (PostgreSQL support began there; no PostgreSQL
 * database predates it). Every later SQLite migration in ../index.ts has a twin of the same name
 * here, in the same order; migrations.spec.ts fails until it has.
 */
export const POSTGRES_MIGRATIONS = [
  PostgresBaseline1765540800000,
  UnitPublishLead1765713600000,
  Demand1765800000000,
  OpenShiftOutsideOffers1765886400000,
  NoticeWindow1765972800000,
  RegisteredSkills1766059200000,
];

/** The SQLite migration that {@link PostgresBaseline1765540800000} catches up with. */
export const POSTGRES_BASELINE_COVERS = 'RosterPeriodChanges1765540800000';
