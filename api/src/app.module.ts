import { Module, type DynamicModule } from '@nestjs/common';
import { APP_FILTER, APP_GUARD, APP_PIPE } from '@nestjs/core';
import { ZodValidationPipe } from 'nestjs-zod';
import { AuthModule } from './auth/auth.module';
import { ClockModule } from './common/clock';
import { CatalogueCsvModule } from './catalogue-csv/catalogue-csv.module';
import { CatalogueEventsModule } from './catalogue-events/catalogue-events.module';
import { AllExceptionsFilter } from './common/filters/all-exceptions.filter';
import { JwtAuthGuard } from './common/guards/jwt-auth.guard';
import { RolesGuard } from './common/guards/roles.guard';
import { WellFormedTextPipe } from './common/pipes/well-formed-text.pipe';
import { ConfigModule } from './config/config.module';
import type { Env } from './config/env';
import { DatabaseModule } from './database/database.module';
import { DatasheetsModule } from './datasheets/datasheets.module';
import { EngineeringModule } from './engineering-routes/engineering.module';
import { HealthModule } from './health/health.module';
import { HousePartBuyersModule } from './house-part-buyers/house-part-buyers.module';
import { HousePartsModule } from './house-parts/house-parts.module';
import { MailModule } from './mail/mail.module';
import { OutboxModule } from './outbox/outbox.module';
import { QualificationRequestsModule } from './qualification-requests/qualification-requests.module';
import { QualificationViewsModule } from './qualification-views/qualification-views.module';
import { QualificationsModule } from './qualifications/qualifications.module';
import { RateLimitsModule } from './rate-limits/rate-limits.module';
import { StorageModule } from './storage/storage.module';
import { SearchModule } from './search/search.module';
import { MeasurementsModule } from './measurements/measurements.module';
import { SeedModule } from './seed/seed.module';
import { TextIndexModule } from './text-index/text-index.module';
import { UsersModule } from './users/users.module';
import { VendorPartsModule } from './vendor-parts/vendor-parts.module';

/** Feature modules, one per resource of the API map. */
const FEATURES = [
  AuthModule,
  UsersModule,
  HealthModule,
  OutboxModule,
  SeedModule,
  EngineeringModule,
  CatalogueEventsModule,
  VendorPartsModule,
  HousePartsModule,
  DatasheetsModule,
  CatalogueCsvModule,
  HousePartBuyersModule,
  QualificationsModule,
  QualificationViewsModule,
  QualificationRequestsModule,
  SearchModule,
  MeasurementsModule,
];

@Module({})
export class AppModule {
  static forRoot(env: Env): DynamicModule {
    return {
      module: AppModule,
      imports: [ConfigModule.forRoot(env), DatabaseModule, ClockModule, TextIndexModule, StorageModule, MailModule, RateLimitsModule, ...FEATURES],
      providers: [
        { provide: APP_GUARD, useClass: JwtAuthGuard },
        { provide: APP_GUARD, useClass: RolesGuard },
        // In this order: text that cannot be stored is refused before the schemas run.
        { provide: APP_PIPE, useClass: WellFormedTextPipe },
        { provide: APP_PIPE, useClass: ZodValidationPipe },
        { provide: APP_FILTER, useClass: AllExceptionsFilter },
      ],
    };
  }
}
