import { Module } from '@nestjs/common';
import { QualificationsModule } from '../qualifications/qualifications.module';
import { SearchController } from './search.controller';
import { SearchRepository } from './search.repository';
import { SearchService } from './search.service';

/** GET /search: read-only queries over the catalogue and the qualification cases. */
@Module({
  imports: [QualificationsModule],
  controllers: [SearchController],
  providers: [SearchRepository, SearchService],
})
export class SearchModule {}
