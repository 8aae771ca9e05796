import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Patch, Post, Put, Query, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiNoContentResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { AnyRole, Roles } from '../common/decorators/roles.decorator';
import {
  AddSourceDto,
  CreateHousePartDto,
  HousePartDto,
  HousePartListQueryDto,
  HousePartPageDto,
  PutSpecDto,
  SourceDto,
  SpecQueryDto,
  SpecVersionDto,
  SpecVersionSummaryDto,
  UpdateHousePartDto,
  UpdateSourceDto,
} from './house-parts.dto';
import { HousePartsService } from './house-parts.service';

@ApiTags('house parts')
@ApiBearerAuth()
@Controller('house-parts')
export class HousePartsController {
  constructor(private readonly houseParts: HousePartsService) {}

  @Get()
  @AnyRole()
  @ApiOkResponse({ type: HousePartPageDto })
  list(@Query() query: HousePartListQueryDto, @CurrentUser() user: AuthUser) {
    return this.houseParts.list(query, user);
  }

  @Post()
  @Roles('engineer')
  @ApiCreatedResponse({ type: HousePartDto })
  create(@Body() body: CreateHousePartDto, @CurrentUser() user: AuthUser) {
    return this.houseParts.create(body, user);
  }

  @Get(':id')
  @AnyRole()
  @ApiOkResponse({ type: HousePartDto })
  get(@Param('id', ParseIntPipe) id: number) {
    return this.houseParts.get(id);
  }

  @Patch(':id')
  @Roles('engineer')
  @ApiOkResponse({ type: HousePartDto })
  update(@Param('id', ParseIntPipe) id: number, @Body() body: UpdateHousePartDto) {
    return this.houseParts.update(id, body);
  }

  @Get(':id/spec')
  @AnyRole()
  @ApiOkResponse({
    type: SpecVersionDto,
    description:
      'The current spec, or `version`. Without `version`, `null` while the house part has no spec yet (a state, not a missing resource); a `version` it does not have is a 404.',
  })
  async spec(@Param('id', ParseIntPipe) id: number, @Query() query: SpecQueryDto, @Res() res: Response): Promise<void> {
    // Express sends an empty body for a returned null; the answer is the JSON null.
    res.json(query.version === undefined ? await this.houseParts.currentSpec(id) : await this.houseParts.spec(id, query.version));
  }

  @Put(':id/spec')
  @Roles('engineer')
  @ApiOkResponse({ type: SpecVersionDto })
  putSpec(@Param('id', ParseIntPipe) id: number, @Body() body: PutSpecDto, @CurrentUser() user: AuthUser) {
    return this.houseParts.putSpec(id, body, user);
  }

  @Get(':id/spec/versions')
  @AnyRole()
  @ApiOkResponse({ type: [SpecVersionSummaryDto] })
  specVersions(@Param('id', ParseIntPipe) id: number) {
    return this.houseParts.specVersions(id);
  }

  @Get(':id/sources')
  @AnyRole()
  @ApiOkResponse({ type: [SourceDto] })
  sources(@Param('id', ParseIntPipe) id: number) {
    return this.houseParts.sources(id);
  }

  @Post(':id/sources')
  @Roles('engineer')
  @ApiCreatedResponse({ type: SourceDto })
  addSource(@Param('id', ParseIntPipe) id: number, @Body() body: AddSourceDto, @CurrentUser() user: AuthUser) {
    return this.houseParts.addSource(id, body, user);
  }

  @Patch(':id/sources/:vendorPartId')
  @Roles('engineer')
  @ApiOkResponse({ type: SourceDto })
  updateSource(@Param('id', ParseIntPipe) id: number, @Param('vendorPartId', ParseIntPipe) vendorPartId: number, @Body() body: UpdateSourceDto) {
    return this.houseParts.updateSource(id, vendorPartId, body);
  }

  @Delete(':id/sources/:vendorPartId')
  @Roles('engineer')
  @HttpCode(204)
  @ApiNoContentResponse()
  removeSource(@Param('id', ParseIntPipe) id: number, @Param('vendorPartId', ParseIntPipe) vendorPartId: number) {
    return this.houseParts.removeSource(id, vendorPartId);
  }
}
