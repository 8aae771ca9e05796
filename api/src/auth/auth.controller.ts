import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { Public } from '../common/decorators/public.decorator';
import { AnyRole } from '../common/decorators/roles.decorator';
import { RateLimit } from '../rate-limits/rate-limit.decorator';
import { AcceptInvitationDto, LoginDto } from './auth.dto';
import { AuthService } from './auth.service';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(private readonly auth: AuthService) {}

  @Public()
  @RateLimit('sign-in')
  @Post('login')
  @HttpCode(200)
  login(@Body() body: LoginDto) {
    return this.auth.login(body);
  }

  @ApiBearerAuth()
  @AnyRole()
  @Get('me')
  me(@CurrentUser() user: AuthUser) {
    return this.auth.me(user);
  }

  @ApiBearerAuth()
  @AnyRole()
  @Post('logout')
  @HttpCode(204)
  logout(@CurrentUser() user: AuthUser) {
    return this.auth.logout(user.id);
  }

  @Public()
  @Get('invitations/:token')
  invitation(@Param('token') token: string) {
    return this.auth.findInvitation(token);
  }

  @Public()
  @RateLimit('public-form')
  @Post('invitations/accept')
  @HttpCode(200)
  accept(@Body() body: AcceptInvitationDto) {
    return this.auth.acceptInvitation(body);
  }
}
