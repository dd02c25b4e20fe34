import { ApiProperty } from '@nestjs/swagger';
import {
  type CoverDayReportDto,
  type CoverReportRowDto,
  type PeriodReportDto,
  type PersonReportDto,
  ROSTER_PERIOD_STATUSES,
  type ReportTotalsDto,
  type RequestNotHonouredDto,
  type RosterPeriodStatus,
} from '@rotaplex/contracts';

const nullableNumber = (description?: string) => ApiProperty({ type: Number, nullable: true, description });

class PersonReportResponse implements PersonReportDto {
  @ApiProperty() staffMemberId!: string;
  @ApiProperty() name!: string;
  @ApiProperty() shifts!: number;
  @ApiProperty() paidMinutes!: number;
  @nullableNumber('Contract minimum scaled to the period') minPaidMinutes!: number | null;
  @nullableNumber('Contract maximum scaled to the period') maxPaidMinutes!: number | null;
  @nullableNumber('Contracted paid minutes for the period') targetPaidMinutes!: number | null;
  @nullableNumber('paidMinutes − targetPaidMinutes') deviationMinutes!: number | null;
  @ApiProperty() nights!: number;
  @ApiProperty() weekendsWorked!: number;
  @ApiProperty() weekendDaysWorked!: number;
  @nullableNumber() hourlyCost!: number | null;
  @nullableNumber('hourlyCost × paid hours, to cents') labourCost!: number | null;
  @ApiProperty() requests!: number;
  @ApiProperty() requestsHonoured!: number;
}

class CoverReportRowResponse implements CoverReportRowDto {
  @ApiProperty({ example: '2027-01-04' }) date!: string;
  @ApiProperty() shiftTypeId!: string;
  @ApiProperty() shiftCode!: string;
  @ApiProperty({ type: String, nullable: true }) skillId!: string | null;
  @ApiProperty({ type: String, nullable: true }) skillCode!: string | null;
  @ApiProperty() min!: number;
  @ApiProperty() target!: number;
  @ApiProperty({ description: 'People on the shift who count towards the need' }) assigned!: number;
  @ApiProperty() shortOfMin!: number;
  @ApiProperty() shortOfTarget!: number;
  @ApiProperty() over!: number;
}

class CoverDayReportResponse implements CoverDayReportDto {
  @ApiProperty() date!: string;
  @ApiProperty() needs!: number;
  @ApiProperty() needsMetMin!: number;
  @ApiProperty() needsMetTarget!: number;
  @ApiProperty() shortOfMin!: number;
  @ApiProperty() shortOfTarget!: number;
  @ApiProperty() over!: number;
}

class RequestNotHonouredResponse implements RequestNotHonouredDto {
  @ApiProperty() staffMemberId!: string;
  @ApiProperty() name!: string;
  @ApiProperty() date!: string;
  @ApiProperty({ example: 'dayOff' }) kind!: string;
  @ApiProperty({ type: [String] }) reasons!: string[];
}

class ReportTotalsResponse implements ReportTotalsDto {
  @ApiProperty() people!: number;
  @ApiProperty() shifts!: number;
  @ApiProperty() paidMinutes!: number;
  @ApiProperty() nights!: number;
  @ApiProperty() weekendDaysWorked!: number;
  @ApiProperty() labourCost!: number;
  @ApiProperty() peopleWithoutCost!: number;
  @ApiProperty() needs!: number;
  @ApiProperty() needsMetMin!: number;
  @ApiProperty() needsMetTarget!: number;
  @ApiProperty() shortOfMin!: number;
  @ApiProperty() shortOfTarget!: number;
  @ApiProperty() over!: number;
  @ApiProperty() requests!: number;
  @ApiProperty() requestsHonoured!: number;
  @ApiProperty({ description: 'Hard-rule findings of the independent checker' }) violations!: number;
}

export class PeriodReportResponse implements PeriodReportDto {
  @ApiProperty() periodId!: string;
  @ApiProperty() unitId!: string;
  @ApiProperty() unitName!: string;
  @ApiProperty() startDate!: string;
  @ApiProperty() days!: number;
  @ApiProperty({ enum: ROSTER_PERIOD_STATUSES }) status!: RosterPeriodStatus;
  @ApiProperty({ type: [String] }) dates!: string[];
  @ApiProperty({ type: [PersonReportResponse] }) people!: PersonReportResponse[];
  @ApiProperty({ type: [CoverReportRowResponse] }) cover!: CoverReportRowResponse[];
  @ApiProperty({ type: [CoverDayReportResponse] }) coverByDay!: CoverDayReportResponse[];
  @ApiProperty({ type: [RequestNotHonouredResponse] }) requestsNotHonoured!: RequestNotHonouredResponse[];
  @ApiProperty({ type: ReportTotalsResponse }) totals!: ReportTotalsResponse;
  @ApiProperty({ type: 'object', additionalProperties: { type: 'number' } })
  objectiveTerms!: Record<string, number>;
  @ApiProperty() objective!: number;
}
