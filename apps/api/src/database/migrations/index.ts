import { InitialSchema1764633600000 } from './1764633600000-initial-schema';
import { PlanningData1764720000000 } from './1764720000000-planning-data';
import { Solving1764806400000 } from './1764806400000-solving';

/** Migrations in the order they run. Add new ones at the end; never edit one that has shipped. */
export const MIGRATIONS = [InitialSchema1764633600000, PlanningData1764720000000, Solving1764806400000];
