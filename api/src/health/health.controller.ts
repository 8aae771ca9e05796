import { Controller, Get, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { Public } from '../common/decorators/public.decorator';
import { HealthService } from './health.service';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly health: HealthService) {}

  /** Readiness: 200 while the database answers (object store or mail down: "degraded"); 503 when it does not. */
  @Public()
  @Get()
  ready(@Res({ passthrough: true }) res: Response) {
    return this.readiness(res);
  }

  /** The same as GET /api/health, under the name load balancers and orchestrators expect. */
  @Public()
  @Get('ready')
  readyAlias(@Res({ passthrough: true }) res: Response) {
    return this.readiness(res);
  }

  /** Liveness: the process is up and serving; answered from memory, never touches a dependency. */
  @Public()
  @Get('live')
  live() {
    return this.health.live();
  }

  private async readiness(res: Response) {
    const report = await this.health.report();
    res.setHeader('Cache-Control', 'no-store');
    if (report.services.database === 'down') res.status(503);
    return report;
  }
}
