import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import { type SkillDto } from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { CreateSkillDto, SkillResponse, UpdateSkillDto } from './dto/skill.dto';
import { SkillsService } from './skills.service';

/** Organisation-wide skills: every signed-in user with units:read reads them; planners write them. */
@ApiTags('skills')
@Controller('skills')
export class SkillsController {
  constructor(private readonly skills: SkillsService) {}

  @Get()
  @RequirePermissions('units:read')
  @ApiOkResponse({ type: [SkillResponse] })
  list(@CurrentUser() user: AuthUser): Promise<SkillDto[]> {
    return this.skills.list(user);
  }

  @Get(':id')
  @RequirePermissions('units:read')
  @ApiOkResponse({ type: SkillResponse })
  get(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<SkillDto> {
    return this.skills.get(user, id);
  }

  @Post()
  @RequirePermissions('rosters:plan')
  @ApiCreatedResponse({ type: SkillResponse })
  @ApiConflictResponse({ description: 'The code is taken' })
  create(@CurrentUser() user: AuthUser, @Body() body: CreateSkillDto): Promise<SkillDto> {
    return this.skills.create(user, body);
  }

  @Patch(':id')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: SkillResponse })
  update(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: UpdateSkillDto,
  ): Promise<SkillDto> {
    return this.skills.update(user, id, body);
  }

  @Delete(':id')
  @HttpCode(204)
  @RequirePermissions('rosters:plan')
  @ApiNoContentResponse()
  @ApiConflictResponse({ description: 'Still used by staff members or cover needs' })
  remove(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<void> {
    return this.skills.remove(user, id);
  }
}
