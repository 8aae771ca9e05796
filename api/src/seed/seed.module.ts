import { Module } from '@nestjs/common';
import { UsersModule } from '../users/users.module';
import { DemoSeedService } from './demo-seed.service';

@Module({ imports: [UsersModule], providers: [DemoSeedService], exports: [DemoSeedService] })
export class SeedModule {}
