import { Body, Controller, Get, Patch, Put } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { OrganisationResponse } from './dto/organisation-response.dto';
import { type NoticeWindowSettingsDto, type OrganisationDto } from '@rotaplex/contracts';
import { NoticeWindowResponse, UpdateNoticeWindowDto } from './dto/notice-window.dto';
import { type AuthUser } from '../common/auth-user';
import { Authenticated, RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { UpdateOrganisationDto } from './dto/update-organisation.dto';
import { OrganisationService } from './organisation.service';

@ApiTags('organisation')
@Controller('organisation')
export class OrganisationController {
  constructor(private readonly organisation: OrganisationService) {}

  @Get()
  @Authenticated()
  @ApiOkResponse({ type: OrganisationResponse })
  get(@CurrentUser() user: AuthUser): Promise<OrganisationDto> {
    return this.organisation.get(user.organisationId);
  }

  /** The notice window for late changes to published rosters, and whether predictability pay is recorded. */
  @Get('notice-window')
  @RequirePermissions('reports:read')
  @ApiOkResponse({ type: NoticeWindowResponse })
  noticeWindow(@CurrentUser() user: AuthUser): Promise<NoticeWindowSettingsDto> {
    return this.organisation.noticeWindow(user.organisationId);
  }

  @Put('notice-window')
  @RequirePermissions('organisation:manage')
  @ApiOkResponse({ type: NoticeWindowResponse })
  setNoticeWindow(
    @CurrentUser() user: AuthUser,
    @Body() body: UpdateNoticeWindowDto,
  ): Promise<NoticeWindowSettingsDto> {
    return this.organisation.setNoticeWindow(user.organisationId, body);
  }

  @Patch()
  @RequirePermissions('organisation:manage')
  @ApiOkResponse({ type: OrganisationResponse })
  update(@CurrentUser() user: AuthUser, @Body() body: UpdateOrganisationDto): Promise<OrganisationDto> {
    return this.organisation.rename(user.organisationId, body.name);
  }
}
