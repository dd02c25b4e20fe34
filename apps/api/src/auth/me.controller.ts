import { Body, Controller, Get, HttpCode, Post, Req } from '@nestjs/common';
import { ApiBadRequestResponse, ApiNoContentResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { MeResponseDto } from './dto/token-response.dto';
import { ApiErrorResponse } from '../common/api-error.dto';
import { type MeResponse } from '@rotaplex/contracts';
import { type Request } from 'express';
import { type AuthUser } from '../common/auth-user';
import { Authenticated } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { readRefreshCookie } from './auth.controller';
import { AuthService } from './auth.service';
import { ChangePasswordDto } from './dto/auth.dto';

@ApiTags('me')
@Controller('me')
@Authenticated()
export class MeController {
  constructor(private readonly auth: AuthService) {}

  @Get()
  @ApiOkResponse({ type: MeResponseDto })
  me(@CurrentUser() user: AuthUser): Promise<MeResponse> {
    return this.auth.me(user);
  }

  @Post('password')
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'Password changed; other sessions have ended' })
  @ApiBadRequestResponse({
    type: ApiErrorResponse,
    description: 'currentPassword is wrong or newPassword too short',
  })
  changePassword(
    @CurrentUser() user: AuthUser,
    @Body() body: ChangePasswordDto,
    @Req() req: Request,
  ): Promise<void> {
    return this.auth.changePassword(user, body.currentPassword, body.newPassword, readRefreshCookie(req));
  }
}
