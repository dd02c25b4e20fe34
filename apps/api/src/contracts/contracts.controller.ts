import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import { CONTRACT_PRESETS, type ContractDto, type ContractPresetDto } from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ContractsService } from './contracts.service';
import {
  ContractPresetResponse,
  ContractQueryDto,
  ContractResponse,
  CreateContractDto,
  UpdateContractDto,
} from './dto/contract.dto';

/**
 * Contracts (work rules, stated per week). Planners read and write those of their units; only
 * admins write organisation-wide ones. Staff do not read contracts.
 */
@ApiTags('contracts')
@Controller('contracts')
export class ContractsController {
  constructor(private readonly contracts: ContractsService) {}

  @Get()
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: [ContractResponse] })
  list(@CurrentUser() user: AuthUser, @Query() query: ContractQueryDto): Promise<ContractDto[]> {
    return this.contracts.list(user, query);
  }

  @Get('presets')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({
    type: [ContractPresetResponse],
    description: 'Common working-time limits, each with its caution',
  })
  presets(): readonly ContractPresetDto[] {
    return CONTRACT_PRESETS;
  }

  @Get(':id')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: ContractResponse })
  get(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<ContractDto> {
    return this.contracts.get(user, id);
  }

  @Post()
  @RequirePermissions('rosters:plan')
  @ApiCreatedResponse({ type: ContractResponse })
  create(@CurrentUser() user: AuthUser, @Body() body: CreateContractDto): Promise<ContractDto> {
    return this.contracts.create(user, body);
  }

  @Patch(':id')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: ContractResponse })
  update(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: UpdateContractDto,
  ): Promise<ContractDto> {
    return this.contracts.update(user, id, body);
  }

  @Delete(':id')
  @HttpCode(204)
  @RequirePermissions('rosters:plan')
  @ApiNoContentResponse()
  @ApiConflictResponse({ description: 'Still held by staff members' })
  remove(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<void> {
    return this.contracts.remove(user, id);
  }
}
