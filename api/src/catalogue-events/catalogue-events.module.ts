import { Global, Module } from '@nestjs/common';
import { CatalogueEvents } from './catalogue-events.service';

/** Global so the catalogue modules publish and the qualification module subscribes without importing each other. */
@Global()
@Module({ providers: [CatalogueEvents], exports: [CatalogueEvents] })
export class CatalogueEventsModule {}
