import { Module } from '@nestjs/common';
import { SearchController } from './search.controller';
import { SearchRepository } from './search.repository';
import { SearchService } from './search.service';

/** GET /search: read-only queries over the catalogue and the qualification cases. */
@Module({
  controllers: [SearchController],
  providers: [SearchRepository, SearchService],
})
export class SearchModule {}
