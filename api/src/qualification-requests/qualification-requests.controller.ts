import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import {
  CreateQualificationRequestDto,
  DeclineQualificationRequestDto,
  OpenCaseFromRequestDto,
  QualificationRequestDto,
  QualificationRequestListQueryDto,
  QualificationRequestPageDto,
} from './qualification-requests.dto';
import { QualificationRequestsService } from './qualification-requests.service';

/**
 * Requests for a qualification. Designers (and engineers) ask and follow their own;
 * engineers take a request up with a case or decline it with a reply; admins read.
 */
@ApiTags('qualification requests')
@ApiBearerAuth()
@Controller('qualification-requests')
export class QualificationRequestsController {
  constructor(private readonly requests: QualificationRequestsService) {}

  @Get()
  @Roles('engineer', 'admin', 'designer')
  @ApiOkResponse({ type: QualificationRequestPageDto })
  list(@Query() query: QualificationRequestListQueryDto, @CurrentUser() user: AuthUser) {
    return this.requests.list(query, user);
  }

  @Post()
  @Roles('designer', 'engineer')
  @ApiCreatedResponse({ type: QualificationRequestDto })
  create(@Body() body: CreateQualificationRequestDto, @CurrentUser() user: AuthUser) {
    return this.requests.create(body, user);
  }

  @Get(':id')
  @Roles('engineer', 'admin', 'designer')
  @ApiOkResponse({ type: QualificationRequestDto })
  get(@Param('id', ParseIntPipe) id: number, @CurrentUser() user: AuthUser) {
    return this.requests.get(id, user);
  }

  /** Opens a qualification case from the request (201); the request is then taken up and points at it. */
  @Post(':id/open-case')
  @Roles('engineer')
  @ApiCreatedResponse({ type: QualificationRequestDto })
  openCase(@Param('id', ParseIntPipe) id: number, @Body() body: OpenCaseFromRequestDto, @CurrentUser() user: AuthUser) {
    return this.requests.openCase(id, body, user);
  }

  @Post(':id/decline')
  @Roles('engineer')
  @HttpCode(200)
  @ApiOkResponse({ type: QualificationRequestDto })
  decline(@Param('id', ParseIntPipe) id: number, @Body() body: DeclineQualificationRequestDto, @CurrentUser() user: AuthUser) {
    return this.requests.decline(id, body, user);
  }
}
