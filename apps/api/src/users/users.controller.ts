import { Body, Controller, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiAcceptedResponse,
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import { UserPageResponse, UserResponse } from './dto/user-response.dto';
import { type Page, type UserDto } from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { InviteUserDto, UpdateUserDto, UsersQueryDto } from './dto/user.dto';
import { UsersService } from './users.service';

@ApiTags('users')
@Controller('users')
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Get()
  @RequirePermissions('users:read')
  @ApiOkResponse({ type: UserPageResponse })
  list(@CurrentUser() caller: AuthUser, @Query() query: UsersQueryDto): Promise<Page<UserDto>> {
    return this.users.list(caller, query);
  }

  @Get(':id')
  @RequirePermissions('users:read')
  @ApiOkResponse({ type: UserResponse })
  get(@CurrentUser() caller: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<UserDto> {
    return this.users.get(caller, id);
  }

  @Post()
  @RequirePermissions('users:write')
  @ApiCreatedResponse({ type: UserResponse, description: 'Created; the invitation e-mail was sent' })
  @ApiConflictResponse({ description: 'The e-mail is taken' })
  invite(@CurrentUser() caller: AuthUser, @Body() body: InviteUserDto): Promise<UserDto> {
    return this.users.invite(caller, body);
  }

  @Patch(':id')
  @RequirePermissions('users:write')
  @ApiOkResponse({ type: UserResponse })
  update(
    @CurrentUser() caller: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: UpdateUserDto,
  ): Promise<UserDto> {
    return this.users.update(caller, id, body);
  }

  @Post(':id/deactivate')
  @HttpCode(200)
  @RequirePermissions('users:write')
  @ApiOkResponse({ type: UserResponse })
  deactivate(@CurrentUser() caller: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<UserDto> {
    return this.users.setActive(caller, id, false);
  }

  @Post(':id/reactivate')
  @HttpCode(200)
  @RequirePermissions('users:write')
  @ApiOkResponse({ type: UserResponse })
  reactivate(@CurrentUser() caller: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<UserDto> {
    return this.users.setActive(caller, id, true);
  }

  @Post(':id/invitation')
  @HttpCode(202)
  @RequirePermissions('users:write')
  @ApiAcceptedResponse({ description: 'A new invitation e-mail was sent; earlier links stop working' })
  resendInvitation(@CurrentUser() caller: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<void> {
    return this.users.resendInvitation(caller, id);
  }
}
