import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import { UnitResponse } from './dto/unit-response.dto';
import { type UnitDto } from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { CreateUnitDto, UpdateUnitDto } from './dto/unit.dto';
import { UnitsService } from './units.service';

@ApiTags('units')
@Controller('units')
export class UnitsController {
  constructor(private readonly units: UnitsService) {}

  @Get()
  @RequirePermissions('units:read')
  @ApiOkResponse({ type: [UnitResponse] })
  list(@CurrentUser() user: AuthUser): Promise<UnitDto[]> {
    return this.units.list(user);
  }

  @Get(':id')
  @RequirePermissions('units:read')
  @ApiOkResponse({ type: UnitResponse })
  get(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<UnitDto> {
    return this.units.get(user, id);
  }

  @Post()
  @RequirePermissions('units:write')
  @ApiCreatedResponse({ type: UnitResponse })
  @ApiConflictResponse({ description: 'A unit with this name exists' })
  create(@CurrentUser() user: AuthUser, @Body() body: CreateUnitDto): Promise<UnitDto> {
    return this.units.create(user, body);
  }

  @Patch(':id')
  @RequirePermissions('units:write')
  @ApiOkResponse({ type: UnitResponse })
  update(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: UpdateUnitDto,
  ): Promise<UnitDto> {
    return this.units.update(user, id, body);
  }

  @Delete(':id')
  @HttpCode(204)
  @RequirePermissions('units:write')
  @ApiNoContentResponse()
  @ApiConflictResponse({ description: 'The unit still has people' })
  remove(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<void> {
    return this.units.remove(user, id);
  }
}
