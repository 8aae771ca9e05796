import { addHousePartBuyerRequestSchema, housePartBuyerSchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class HousePartBuyerDto extends createZodDto(housePartBuyerSchema) {}
export class AddHousePartBuyerDto extends createZodDto(addHousePartBuyerRequestSchema) {}
