import { InitialSchema1764633600000 } from './1764633600000-initial-schema';
import { PlanningData1764720000000 } from './1764720000000-planning-data';

/** Migrations in the order they run. Add new ones at the end; never edit one that has shipped. */
export const MIGRATIONS = [InitialSchema1764633600000, PlanningData1764720000000];
