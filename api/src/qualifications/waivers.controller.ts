import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { approveWaiverRequestSchema, createWaiverRequestSchema, refuseWaiverRequestSchema, waiverListSchema, waiverSchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { WaiversService } from './waivers.service';

export class WaiverDto extends createZodDto(waiverSchema) {}
export class WaiverListDto extends createZodDto(waiverListSchema) {}
export class CreateWaiverDto extends createZodDto(createWaiverRequestSchema) {}
export class ApproveWaiverDto extends createZodDto(approveWaiverRequestSchema) {}
export class RefuseWaiverDto extends createZodDto(refuseWaiverRequestSchema) {}

/**
 * Waivers of a case's failing or marginal checks. Engineers prepare them and another
 * engineer approves or refuses (the rule is in contracts' source-standing.ts); admins read.
 * Designers and buyers see approved waivers on Sources and search rows.
 */
@ApiTags('qualifications')
@ApiBearerAuth()
@Controller('qualifications/:id/waivers')
export class WaiversController {
  constructor(private readonly waivers: WaiversService) {}

  @Get()
  @Roles('engineer', 'admin')
  @ApiOkResponse({ type: WaiverListDto })
  list(@Param('id', ParseIntPipe) id: number) {
    return this.waivers.list(id);
  }

  @Post()
  @Roles('engineer')
  @ApiCreatedResponse({ type: WaiverDto })
  create(@Param('id', ParseIntPipe) id: number, @Body() body: CreateWaiverDto, @CurrentUser() user: AuthUser) {
    return this.waivers.create(id, body, user);
  }

  @Post(':waiverId/approve')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: WaiverDto })
  approve(
    @Param('id', ParseIntPipe) id: number,
    @Param('waiverId', ParseIntPipe) waiverId: number,
    @Body() body: ApproveWaiverDto,
    @CurrentUser() user: AuthUser,
  ) {
    return this.waivers.approve(id, waiverId, body, user);
  }

  @Post(':waiverId/refuse')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: WaiverDto })
  refuse(
    @Param('id', ParseIntPipe) id: number,
    @Param('waiverId', ParseIntPipe) waiverId: number,
    @Body() body: RefuseWaiverDto,
    @CurrentUser() user: AuthUser,
  ) {
    return this.waivers.refuse(id, waiverId, body, user);
  }
}
