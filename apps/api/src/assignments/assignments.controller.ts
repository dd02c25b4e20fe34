import { Body, Controller, Get, HttpCode, Param, Post, Put } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import { ApiConflictResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { type AssignmentGridDto } from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { AssignmentsService } from './assignments.service';
import { AssignmentCellDto, AssignmentGridResponse, PinCellDto } from './dto/assignment.dto';

/** A period's roster for planners: the grid with the checker's findings, cell edits, pins. */
@ApiTags('assignments')
@Controller('roster-periods/:id/assignments')
export class AssignmentsController {
  constructor(private readonly assignments: AssignmentsService) {}

  @Get()
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: AssignmentGridResponse })
  grid(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<AssignmentGridDto> {
    return this.assignments.grid(user, id);
  }

  @Put('cell')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({
    type: AssignmentGridResponse,
    description: "The edited roster with the checker's violations",
  })
  @ApiConflictResponse({ description: 'The period is not a draft' })
  edit(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: AssignmentCellDto,
  ): Promise<AssignmentGridDto> {
    return this.assignments.editCell(user, id, body);
  }

  @Post('pin')
  @HttpCode(200)
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: AssignmentGridResponse })
  pin(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: PinCellDto,
  ): Promise<AssignmentGridDto> {
    return this.assignments.setPinned(user, id, body, true);
  }

  @Post('unpin')
  @HttpCode(200)
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: AssignmentGridResponse })
  unpin(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: PinCellDto,
  ): Promise<AssignmentGridDto> {
    return this.assignments.setPinned(user, id, body, false);
  }
}
