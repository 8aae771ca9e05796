import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { CreateInvitationDto, UpdateUserDto } from './users.dto';
import { UsersService } from './users.service';

@ApiTags('users')
@ApiBearerAuth()
@Roles('admin')
@Controller('users')
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Get()
  list() {
    return this.users.list();
  }

  @Get('invitations')
  invitations() {
    return this.users.listInvitations();
  }

  @Post('invitations')
  invite(@Body() body: CreateInvitationDto, @CurrentUser() admin: AuthUser) {
    return this.users.invite(body, admin);
  }

  @Post('invitations/:id/resend')
  @HttpCode(200)
  resend(@Param('id', ParseIntPipe) id: number, @CurrentUser() admin: AuthUser) {
    return this.users.resendInvitation(id, admin);
  }

  @Post('invitations/:id/revoke')
  @HttpCode(200)
  revoke(@Param('id', ParseIntPipe) id: number) {
    return this.users.revokeInvitation(id);
  }

  @Patch(':id')
  update(@Param('id', ParseIntPipe) id: number, @Body() body: UpdateUserDto, @CurrentUser() admin: AuthUser) {
    return this.users.update(id, body, admin);
  }
}
