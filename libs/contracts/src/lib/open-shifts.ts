/**
 * Open shifts nobody on the roster may take: what it would take (which rule for whom) and the record
 * of offering one to bank or agency staff outside the roster. Plain types shared by the API and the
 * web app; the list itself and claims are in ./swaps.
 */

/** offered: asked outside the roster; filled: people from outside will work it; withdrawn: taken back. */
export const OUTSIDE_OFFER_STATUSES = ['offered', 'filled', 'withdrawn'] as const;
export type OutsideOfferStatus = (typeof OUTSIDE_OFFER_STATUSES)[number];

export const OUTSIDE_OFFER_TO_MAX_LENGTH = 200;
export const OUTSIDE_OFFER_NOTE_MAX_LENGTH = 500;

/** One open shift offered to bank or agency staff outside the roster. */
export interface OutsideOfferDto {
  id: string;
  rosterPeriodId: string;
  date: string;
  shiftTypeId: string;
  skillId: string | null;
  /** To whom, in the manager's words (a bank office, an agency). */
  offeredTo: string;
  note: string | null;
  status: OutsideOfferStatus;
  /** Filled only: how many people from outside will work it. */
  people: number | null;
  offeredByName: string;
  offeredAt: string;
  updatedAt: string;
}

/** Body of POST /open-shifts/outside-offers. */
export interface CreateOutsideOfferDto {
  rosterPeriodId: string;
  date: string;
  shiftTypeId: string;
  skillId: string | null;
  offeredTo: string;
  note?: string;
}

/** Body of POST /open-shifts/outside-offers/:id/filled (people: default every person still wanted). */
export interface FillOutsideOfferDto {
  people?: number;
}

/** Query of GET /open-shifts/what-it-would-take: one open shift. */
export interface WhatItWouldTakeQuery {
  rosterPeriodId: string;
  date: string;
  shiftTypeId: string;
  /** Omitted or empty: a need open to anyone. */
  skillId?: string;
}

/** One rule a person would break by taking the shift, in words with dates and hours. */
export interface RuleBreakDto {
  rule: string;
  /** A rule whose breach by a manual edit needs a written reason (OVERRIDE_REASON_RULES). */
  serious: boolean;
  words: string;
}

/** One person of the unit with the skill, free of leave that day, and what taking the shift breaks. */
export interface CandidateDto {
  staffMemberId: string;
  name: string;
  /** Empty: this person may take it now. */
  breaks: RuleBreakDto[];
  /** The shift this person already works that day (taking this one would leave that one short). */
  alreadyWorks: string | null;
}

export interface WhatItWouldTakeDto {
  rosterPeriodId: string;
  date: string;
  shiftTypeId: string;
  skillId: string | null;
  /** Nearest first: fewest serious breaks, then fewest breaks, then name. */
  candidates: CandidateDto[];
  /** People of the unit with the skill who are on leave, unavailable or off by contract that day. */
  absent: number;
  /** Fatigue and working-time cautions, deferring to local law, agreements and licensed practice. */
  cautions: string[];
  /** How the product lets a manager change the roster for one of them, in words. */
  howToChange: string;
}

const e = encodeURIComponent;

export const OPEN_SHIFT_ROUTES = {
  whatItWouldTake: '/open-shifts/what-it-would-take',
  outsideOffers: '/open-shifts/outside-offers',
  outsideOfferWithdraw: (id: string) => `/open-shifts/outside-offers/${e(id)}/withdraw`,
  outsideOfferFilled: (id: string) => `/open-shifts/outside-offers/${e(id)}/filled`,
} as const;
