import { Controller, Get } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { Roles } from '../common/decorators/roles.decorator';
import { OutboxService } from './outbox.service';

@ApiTags('outbox')
@ApiBearerAuth()
@Roles('admin')
@Controller('outbox')
export class OutboxController {
  constructor(private readonly outbox: OutboxService) {}

  @Get()
  list() {
    return this.outbox.list();
  }
}
