import { OneTimeTokenEntity } from '../auth/one-time-token.entity';
import { SwapLinkTokenEntity, SwapRequestEntity } from '../swaps/swap-request.entity';
import { RefreshTokenEntity } from '../auth/refresh-token.entity';
import { MailMessageEntity } from '../mail/mail-message.entity';
import { OrganisationEntity } from '../organisation/organisation.entity';
import { UnitEntity } from '../units/unit.entity';
import { UserEntity } from '../users/user.entity';
import { SkillEntity } from '../skills/skill.entity';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { ContractEntity } from '../contracts/contract.entity';
import { StaffMemberEntity } from '../staff/staff-member.entity';
import { CoverOverrideEntity, CoverPatternRowEntity } from '../cover-needs/cover-need.entity';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { RosterPeriodChangeEntity } from '../roster-periods/roster-period-change.entity';
import { SolveRunEntity } from '../solve-runs/solve-run.entity';
import { AssignmentEntity } from '../assignments/assignment.entity';
import { CalendarFeedEntity, CalendarFeedEventEntity } from '../my-roster/calendar-feed.entity';
import { AvailabilityCellEntity, DateRequestEntity, LeaveRequestEntity } from '../requests/requests.entities';
import { OutboxMessageEntity } from '../outbox/outbox-message.entity';
import { AuditEntryEntity } from '../audit/audit-entry.entity';
import { RosterPublicationEntity } from '../publishing/roster-publication.entity';
import { DemandAcceptanceEntity, UnitDemandEntity } from '../demand/demand.entities';

/** Every entity of the schema; the migrations in ./migrations must produce exactly these tables. */
export const ENTITIES = [
  OrganisationEntity,
  UnitEntity,
  UserEntity,
  RefreshTokenEntity,
  OneTimeTokenEntity,
  MailMessageEntity,
  SkillEntity,
  ShiftTypeEntity,
  ContractEntity,
  StaffMemberEntity,
  CoverPatternRowEntity,
  CoverOverrideEntity,
  RosterPeriodEntity,
  RosterPeriodChangeEntity,
  SolveRunEntity,
  AssignmentEntity,
  CalendarFeedEntity,
  CalendarFeedEventEntity,
  OutboxMessageEntity,
  AuditEntryEntity,
  RosterPublicationEntity,
  AvailabilityCellEntity,
  DateRequestEntity,
  LeaveRequestEntity,
  SwapRequestEntity,
  SwapLinkTokenEntity,
  UnitDemandEntity,
  DemandAcceptanceEntity,
];
