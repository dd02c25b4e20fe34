import { type EntityManager } from 'typeorm';

/** An open shift of a period: its date, shift type and skill (null: anyone). */
export interface ClaimedNeed {
  date: string;
  shiftTypeId: string;
  skillId: string | null;
}

/**
 * Where people from outside the roster (bank or agency staff) are recorded on an open shift. The
 * open-shifts module keeps them and registers itself through `SwapsService.coverOutsideFrom`, so
 * swaps reach them through that module's service without importing it (open shifts build on swaps).
 */
export interface OutsideCover {
  /** How many people from outside the roster fill the need now, read in `em`'s transaction. */
  filledOutside(em: EntityManager, periodId: string, need: ClaimedNeed): Promise<number>;
}
