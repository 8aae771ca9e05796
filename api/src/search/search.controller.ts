import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Roles } from '../common/decorators/roles.decorator';
import { SearchFacetsDto, SearchPageDto, SearchQueryDto } from './search.dto';
import { SearchService } from './search.service';

/** The designers' search over the parts they may design in (engineers and admins use it too; buyers have the Sources view). */
@ApiTags('search')
@ApiBearerAuth()
@Roles('designer', 'engineer', 'admin')
@Controller('search')
export class SearchController {
  constructor(private readonly search: SearchService) {}

  /** Usable parts (approved sources and cleared alternates) by parametric filters and fuzzy text, one page at a time. */
  @Get()
  @ApiOkResponse({ type: SearchPageDto })
  find(@Query() query: SearchQueryDto) {
    return this.search.search(query);
  }

  /** The packages, manufacturers and house parts the filters offer, with counts. */
  @Get('facets')
  @ApiOkResponse({ type: SearchFacetsDto })
  facets() {
    return this.search.facets();
  }
}
