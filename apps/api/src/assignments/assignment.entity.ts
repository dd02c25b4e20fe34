/**
 * The cells' entity lives with their period: roster-periods/assignment.entity.ts. This file keeps
 * the old import path working for a type import (swaps/swap-evaluation.ts) and holds no entity:
 * import from roster-periods instead, and delete it once nothing imports it.
 */
export type { AssignmentEntity } from '../roster-periods/assignment.entity';
