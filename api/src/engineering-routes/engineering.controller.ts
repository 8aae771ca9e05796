import { Body, Controller, HttpCode, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { AnyRole } from '../common/decorators/roles.decorator';
import { NormalizeRequestDto, NormalizeResponseDto, RegulatorRequestDto, RegulatorResponseDto } from './engineering.dto';
import { normalize } from '../engineering/normalize';
import { designRegulator } from '../engineering/regulator';

/** Computations only: nothing is stored, so both answer 200 rather than 201. */
@ApiTags('engineering')
@ApiBearerAuth()
@AnyRole()
@Controller('engineering')
export class EngineeringController {
  /** A card at the caller's currents and ambients, with its fitted model and `.model` line. */
  @Post('normalize')
  @HttpCode(200)
  @ApiOkResponse({ type: NormalizeResponseDto })
  normalize(@Body() body: NormalizeRequestDto) {
    return normalize(body);
  }

  /** A shunt regulator designed around a card: resistor range, standard value, power, regulation, output band. */
  @Post('regulator')
  @HttpCode(200)
  @ApiOkResponse({ type: RegulatorResponseDto })
  regulator(@Body() body: RegulatorRequestDto) {
    return designRegulator(body);
  }
}
