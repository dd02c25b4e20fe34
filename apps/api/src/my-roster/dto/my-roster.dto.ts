import { ApiProperty } from '@nestjs/swagger';
import {
  type CalendarFeedDto,
  type MyRosterDto,
  type MyRosterQuery,
  type MyRosterShiftDto,
  type MyRosterUnitDto,
  SHIFT_COLOURS,
  type ShiftColour,
} from '@rotaplex/contracts';
import { IsIsoDate } from '../../common/decorators/is-iso-date.decorator';

export class MyRosterQueryDto implements MyRosterQuery {
  @ApiProperty({ example: '2027-01-04', description: 'First day, YYYY-MM-DD' })
  @IsIsoDate()
  from!: string;

  @ApiProperty({ example: '2027-01-31', description: 'Last day, YYYY-MM-DD (at most 100 days after from)' })
  @IsIsoDate()
  to!: string;
}

export class MyRosterShiftResponse implements MyRosterShiftDto {
  @ApiProperty({ description: "Whether the shift is the caller's own" })
  mine!: boolean;
  @ApiProperty({ description: 'Name of the person working it' })
  name!: string;
  @ApiProperty({ format: 'uuid' })
  unitId!: string;
  @ApiProperty()
  unitName!: string;
  @ApiProperty({ example: 'Europe/London' })
  timeZone!: string;
  @ApiProperty({ example: '2027-01-04' })
  date!: string;
  @ApiProperty({ example: 'E' })
  shiftCode!: string;
  @ApiProperty({ example: 'Early' })
  shiftName!: string;
  @ApiProperty({ enum: SHIFT_COLOURS })
  colour!: ShiftColour;
  @ApiProperty({ format: 'date-time' })
  start!: string;
  @ApiProperty({ format: 'date-time' })
  end!: string;
}

export class MyRosterUnitResponse implements MyRosterUnitDto {
  @ApiProperty({ format: 'uuid' })
  unitId!: string;
  @ApiProperty()
  unitName!: string;
  @ApiProperty({ example: 'Europe/London' })
  timeZone!: string;
}

export class MyRosterResponse implements MyRosterDto {
  @ApiProperty()
  from!: string;
  @ApiProperty()
  to!: string;
  @ApiProperty({ type: [MyRosterUnitResponse] })
  units!: MyRosterUnitResponse[];
  @ApiProperty({ type: [MyRosterShiftResponse] })
  shifts!: MyRosterShiftResponse[];
}

export class CalendarFeedResponse implements CalendarFeedDto {
  @ApiProperty({ description: 'Secret feed URL; works without sign-in until regenerated' })
  url!: string;
}
