import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import { type ShiftTypeDto } from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { CreateShiftTypeDto, ShiftTypeResponse, UpdateShiftTypeDto } from './dto/shift-type.dto';
import { ShiftTypesService } from './shift-types.service';

/** Shift types of one unit: read by anyone in the unit, written by its planners. */
@ApiTags('shift types')
@Controller('units/:unitId/shift-types')
export class ShiftTypesController {
  constructor(private readonly shiftTypes: ShiftTypesService) {}

  @Get()
  @RequirePermissions('units:read')
  @ApiOkResponse({ type: [ShiftTypeResponse] })
  list(@CurrentUser() user: AuthUser, @Param('unitId', ParseIdPipe) unitId: string): Promise<ShiftTypeDto[]> {
    return this.shiftTypes.list(user, unitId);
  }

  @Get(':id')
  @RequirePermissions('units:read')
  @ApiOkResponse({ type: ShiftTypeResponse })
  get(
    @CurrentUser() user: AuthUser,
    @Param('unitId', ParseIdPipe) unitId: string,
    @Param('id', ParseIdPipe) id: string,
  ): Promise<ShiftTypeDto> {
    return this.shiftTypes.get(user, unitId, id);
  }

  @Post()
  @RequirePermissions('rosters:plan')
  @ApiCreatedResponse({ type: ShiftTypeResponse })
  @ApiConflictResponse({ description: 'The code is taken in this unit' })
  create(
    @CurrentUser() user: AuthUser,
    @Param('unitId', ParseIdPipe) unitId: string,
    @Body() body: CreateShiftTypeDto,
  ): Promise<ShiftTypeDto> {
    return this.shiftTypes.create(user, unitId, body);
  }

  @Patch(':id')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: ShiftTypeResponse })
  update(
    @CurrentUser() user: AuthUser,
    @Param('unitId', ParseIdPipe) unitId: string,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: UpdateShiftTypeDto,
  ): Promise<ShiftTypeDto> {
    return this.shiftTypes.update(user, unitId, id, body);
  }

  @Delete(':id')
  @HttpCode(204)
  @RequirePermissions('rosters:plan')
  @ApiNoContentResponse()
  @ApiConflictResponse({ description: 'Still used by cover needs' })
  remove(
    @CurrentUser() user: AuthUser,
    @Param('unitId', ParseIdPipe) unitId: string,
    @Param('id', ParseIdPipe) id: string,
  ): Promise<void> {
    return this.shiftTypes.remove(user, unitId, id);
  }
}
