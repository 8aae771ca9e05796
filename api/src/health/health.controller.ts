import { Controller, Get, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { Public } from '../common/decorators/public.decorator';
import { HealthService } from './health.service';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly health: HealthService) {}

  /** 200 while the database answers (other services may be down: "degraded"); 503 when it does not. */
  @Public()
  @Get()
  async get(@Res({ passthrough: true }) res: Response) {
    const report = await this.health.report();
    if (report.services.database === 'down') res.status(503);
    return report;
  }
}
