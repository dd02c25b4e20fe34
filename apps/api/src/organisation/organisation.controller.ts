import { Body, Controller, Get, Patch } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { OrganisationResponse } from './dto/organisation-response.dto';
import { type OrganisationDto } from '@rotaplex/contracts';
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

  @Patch()
  @RequirePermissions('organisation:manage')
  @ApiOkResponse({ type: OrganisationResponse })
  update(@CurrentUser() user: AuthUser, @Body() body: UpdateOrganisationDto): Promise<OrganisationDto> {
    return this.organisation.rename(user.organisationId, body.name);
  }
}
