import type { OutsideOfferDto } from './open-shifts';
import type { RedFlagDto } from './safe-staffing';

/**
 * Swaps, give-aways and open-shift claims on a published roster, and the e-mailed decision links.
 * One change request type covers all three: a swap (A and B exchange shifts), an offer (A gives a
 * shift to B) and a claim (a staff member takes an open shift). A claim skips the colleague step.
 */
import { type RosterViolationDto } from './solving';

export const SWAP_KINDS = ['swap', 'offer', 'claim'] as const;
export type SwapKind = (typeof SWAP_KINDS)[number];

export const SWAP_STATUSES = [
  /** Waiting for the colleague (B). */
  'proposed',
  /** B accepted (or an open-shift claim was made): waiting for a manager. */
  'accepted',
  'declined',
  'approved',
  /** A manager declined, or approval found the roster changed or a rule broken. */
  'refused',
  'cancelled',
  'expired',
] as const;
export type SwapStatus = (typeof SWAP_STATUSES)[number];

/** Statuses in which nothing more can happen. */
export const SWAP_FINAL_STATUSES: readonly SwapStatus[] = [
  'declined',
  'approved',
  'refused',
  'cancelled',
  'expired',
];

/** One cell a request changes: the shift before (recorded at proposal) and after. */
export interface SwapCellChangeDto {
  staffMemberId: string;
  staffName: string;
  /** "YYYY-MM-DD" */
  date: string;
  beforeShiftTypeId: string | null;
  beforeShiftCode: string | null;
  afterShiftTypeId: string | null;
  afterShiftCode: string | null;
}

export interface SwapRequestDto {
  id: string;
  kind: SwapKind;
  status: SwapStatus;
  rosterPeriodId: string;
  unitId: string;
  proposerStaffMemberId: string;
  proposerName: string;
  /** Null for an open-shift claim. */
  colleagueStaffMemberId: string | null;
  colleagueName: string | null;
  changes: SwapCellChangeDto[];
  note: string | null;
  /** Why it was refused, declined or expired (plain words). */
  outcome: string | null;
  createdAt: string;
  updatedAt: string;
  /** What the caller may do with it now. */
  actions: SwapAction[];
}

export type SwapAction = 'accept' | 'decline' | 'cancel' | 'approve' | 'refuse';

/** Propose: `kind: 'swap'` needs theirDate (B's shift on it is taken in exchange); 'offer' gives my shift to B. */
export interface ProposeSwapDto {
  kind: 'swap' | 'offer';
  rosterPeriodId: string;
  /** My working day to give or exchange. */
  myDate: string;
  colleagueStaffMemberId: string;
  /** Swap only: the colleague's working day whose shift I take. */
  theirDate?: string;
  note?: string;
}

/** The checker's findings for the two (or one) people involved, before anything is sent. */
export interface SwapPreviewDto {
  changes: SwapCellChangeDto[];
  /** Hard-rule violations of the people involved after the change. */
  violations: (RosterViolationDto & { isNew: boolean })[];
  /** True when a violation is new (not in the roster before the change): proposing is refused. */
  blocked: boolean;
  /** Cover shortfall below minimum (checker term) before and after: a rise is a warning, not a refusal. */
  coverUnderMinBefore: number;
  coverUnderMinAfter: number;
}

/** Body of a decision (in the app or through an e-mail link). */
export interface SwapDecisionDto {
  decision: 'accept' | 'decline' | 'approve' | 'refuse';
  reason?: string;
}

/** What an e-mail link's page shows before the person confirms (GET changes nothing). */
export interface SwapLinkViewDto {
  /** Which decisions this link may make. */
  decisions: SwapDecisionDto['decision'][];
  role: 'colleague' | 'manager';
  actorName: string;
  swap: SwapRequestDto;
  unitName: string;
  timeZone: string;
}

export interface SwapLinkDecisionDto extends SwapDecisionDto {
  token: string;
}

/** Cover still unmet on a published period, and whether the caller could claim it. */
export interface OpenShiftDto {
  rosterPeriodId: string;
  unitId: string;
  date: string;
  shiftTypeId: string;
  shiftCode: string;
  shiftName: string;
  start: string;
  end: string;
  skillId: string | null;
  skillCode: string | null;
  /** People still wanted (target minus assigned with the skill). */
  short: number;
  /** Of those, people short of the minimum (0 when only the target is unmet): a safety shortfall. */
  belowMinimum: number;
  /** Pending claims on this shift. */
  pendingClaims: number;
  /**
   * A red flag of safe staffing (NICE SG1 2014; see safe-staffing.ts) when the skill is registered and
   * the shortfall, after people filled from outside the roster, is one; null or absent otherwise.
   */
  redFlag?: RedFlagDto | null;
  /**
   * Staff asking with `withBlocked=true` only: whether the caller may take this shift, and if not why,
   * in words (skill, already working, rest, hours, runs of days, weekends, leave). Absent otherwise.
   */
  mayTake?: boolean;
  whyNot?: string[];
  /** The current offer of this shift to bank or agency staff outside the roster, if any. */
  outsideOffer?: OutsideOfferDto | null;
}

/** Query of GET /open-shifts. */
export interface OpenShiftListQuery {
  page?: number;
  pageSize?: number;
  rosterPeriodId?: string;
  /** Staff: list every open shift, those the caller may not take too, with the reasons (`whyNot`). */
  withBlocked?: boolean;
}

/** Body of POST /open-shifts/notify: e-mail the staff who may take one open shift. */
export interface NotifyOpenShiftDto {
  rosterPeriodId: string;
  date: string;
  shiftTypeId: string;
  skillId: string | null;
}

export interface NotifyOpenShiftResultDto {
  /** People e-mailed (those who may take the shift). */
  notified: number;
}

export interface ClaimOpenShiftDto {
  rosterPeriodId: string;
  date: string;
  shiftTypeId: string;
  skillId: string | null;
  note?: string;
}

/** My published shifts a swap may start from, and colleagues to offer them to. */
export interface SwapOptionsDto {
  rosterPeriodId: string;
  myStaffMemberId: string;
  myShifts: { date: string; shiftTypeId: string; shiftCode: string }[];
  colleagues: {
    staffMemberId: string;
    name: string;
    shifts: { date: string; shiftTypeId: string; shiftCode: string }[];
  }[];
}

export const SWAP_ROUTES = {
  swaps: '/swaps',
  swapOptions: '/swaps/options',
  swapPreview: '/swaps/preview',
  swap: (id: string) => `/swaps/${encodeURIComponent(id)}`,
  swapDecide: (id: string) => `/swaps/${encodeURIComponent(id)}/decision`,
  swapCancel: (id: string) => `/swaps/${encodeURIComponent(id)}/cancel`,
  swapLink: '/swap-links',
  openShifts: '/open-shifts',
  openShiftsNotify: '/open-shifts/notify',
  openShiftClaims: '/open-shifts/claims',
} as const;

/** Web path of the public decision page that e-mail links open (token in the query). */
export const SWAP_DECISION_WEB_PATH = '/swap-decision';
