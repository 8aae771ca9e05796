import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Patch, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import {
  ApproveDto,
  ClearDto,
  ClearWithConditionsDto,
  CommentDto,
  CreateQualificationDto,
  EvaluateDto,
  QualificationDto,
  QualificationListQueryDto,
  QualificationPageDto,
  RecheckDto,
  RejectDto,
  RevokeDto,
  SendBackDto,
  SubmitDto,
  UpdateQualificationDto,
  WithdrawDto,
} from './qualifications.dto';
import { QualificationsService } from './qualifications.service';

/**
 * Qualification cases. Engineers prepare and decide (never their own case); admins read;
 * designers read cleared cases. State changes are `POST /:id/<action>`, each answering the
 * case as it is afterwards.
 */
@ApiTags('qualifications')
@ApiBearerAuth()
@Controller('qualifications')
export class QualificationsController {
  constructor(private readonly cases: QualificationsService) {}

  @Get()
  @Roles('engineer', 'admin', 'designer')
  @ApiOkResponse({ type: QualificationPageDto })
  list(@Query() query: QualificationListQueryDto, @CurrentUser() user: AuthUser) {
    return this.cases.list(query, user);
  }

  @Post()
  @Roles('engineer')
  @ApiCreatedResponse({ type: QualificationDto })
  create(@Body() body: CreateQualificationDto, @CurrentUser() user: AuthUser) {
    return this.cases.create(body, user);
  }

  @Get(':id')
  @Roles('engineer', 'admin', 'designer')
  @ApiOkResponse({ type: QualificationDto })
  get(@Param('id', ParseIntPipe) id: number, @CurrentUser() user: AuthUser) {
    return this.cases.get(id, user);
  }

  @Patch(':id')
  @Roles('engineer')
  @ApiOkResponse({ type: QualificationDto })
  update(@Param('id', ParseIntPipe) id: number, @Body() body: UpdateQualificationDto, @CurrentUser() user: AuthUser) {
    return this.cases.update(id, body, user);
  }

  @Post(':id/comments')
  @Roles('engineer')
  @ApiCreatedResponse({ type: QualificationDto })
  comment(@Param('id', ParseIntPipe) id: number, @Body() body: CommentDto, @CurrentUser() user: AuthUser) {
    return this.cases.comment(id, body.text, user);
  }

  @Post(':id/evaluate')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: QualificationDto })
  evaluate(@Param('id', ParseIntPipe) id: number, @Body() body: EvaluateDto, @CurrentUser() user: AuthUser) {
    return this.cases.act(id, 'evaluate', body, user);
  }

  @Post(':id/submit')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: QualificationDto })
  submit(@Param('id', ParseIntPipe) id: number, @Body() body: SubmitDto, @CurrentUser() user: AuthUser) {
    return this.cases.act(id, 'submit', body, user);
  }

  @Post(':id/send-back')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: QualificationDto })
  sendBack(@Param('id', ParseIntPipe) id: number, @Body() body: SendBackDto, @CurrentUser() user: AuthUser) {
    return this.cases.act(id, 'send-back', body, user);
  }

  /** A second engineer makes the source the house part's approved source (buyers are mailed). */
  @Post(':id/approve')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: QualificationDto })
  approve(@Param('id', ParseIntPipe) id: number, @Body() body: ApproveDto, @CurrentUser() user: AuthUser) {
    return this.cases.act(id, 'approve', body, user);
  }

  @Post(':id/clear')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: QualificationDto })
  clear(@Param('id', ParseIntPipe) id: number, @Body() body: ClearDto, @CurrentUser() user: AuthUser) {
    return this.cases.act(id, 'clear', body, user);
  }

  @Post(':id/clear-with-conditions')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: QualificationDto })
  clearWithConditions(@Param('id', ParseIntPipe) id: number, @Body() body: ClearWithConditionsDto, @CurrentUser() user: AuthUser) {
    return this.cases.act(id, 'clear-with-conditions', body, user);
  }

  @Post(':id/reject')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: QualificationDto })
  reject(@Param('id', ParseIntPipe) id: number, @Body() body: RejectDto, @CurrentUser() user: AuthUser) {
    return this.cases.act(id, 'reject', body, user);
  }

  @Post(':id/withdraw')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: QualificationDto })
  withdraw(@Param('id', ParseIntPipe) id: number, @Body() body: WithdrawDto, @CurrentUser() user: AuthUser) {
    return this.cases.act(id, 'withdraw', body, user);
  }

  @Post(':id/revoke')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: QualificationDto })
  revoke(@Param('id', ParseIntPipe) id: number, @Body() body: RevokeDto, @CurrentUser() user: AuthUser) {
    return this.cases.act(id, 'revoke', body, user);
  }

  /** Opens a new revision of a decided case and answers it (201). */
  @Post(':id/recheck')
  @Roles('engineer')
  @ApiCreatedResponse({ type: QualificationDto })
  recheck(@Param('id', ParseIntPipe) id: number, @Body() body: RecheckDto, @CurrentUser() user: AuthUser) {
    return this.cases.act(id, 'recheck', body, user);
  }
}
