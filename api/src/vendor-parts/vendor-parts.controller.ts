import { Body, Controller, Get, Param, ParseIntPipe, Patch, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { AnyRole, Roles } from '../common/decorators/roles.decorator';
import { CreateVendorPartDto, ManufacturerDto, UpdateVendorPartDto, VendorPartDetailDto, VendorPartListQueryDto, VendorPartPageDto } from './vendor-parts.dto';
import { VendorPartsService } from './vendor-parts.service';

@ApiTags('vendor parts')
@ApiBearerAuth()
@Controller()
export class VendorPartsController {
  constructor(private readonly vendorParts: VendorPartsService) {}

  @Get('vendor-parts')
  @AnyRole()
  @ApiOkResponse({ type: VendorPartPageDto })
  list(@Query() query: VendorPartListQueryDto) {
    return this.vendorParts.list(query);
  }

  @Post('vendor-parts')
  @Roles('engineer')
  @ApiCreatedResponse({ type: VendorPartDetailDto })
  create(@Body() body: CreateVendorPartDto, @CurrentUser() user: AuthUser) {
    return this.vendorParts.create(body, user);
  }

  @Get('vendor-parts/:id')
  @AnyRole()
  @ApiOkResponse({ type: VendorPartDetailDto })
  get(@Param('id', ParseIntPipe) id: number) {
    return this.vendorParts.get(id);
  }

  @Patch('vendor-parts/:id')
  @Roles('engineer')
  @ApiOkResponse({ type: VendorPartDetailDto })
  update(@Param('id', ParseIntPipe) id: number, @Body() body: UpdateVendorPartDto) {
    return this.vendorParts.update(id, body);
  }

  @Get('manufacturers')
  @AnyRole()
  @ApiOkResponse({ type: [ManufacturerDto] })
  manufacturers() {
    return this.vendorParts.manufacturers();
  }
}
