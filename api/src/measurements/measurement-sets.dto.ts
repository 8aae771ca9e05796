import { measurementCsvReadingSchema, measurementSetFieldsSchema, measurementSetQuerySchema, measurementSetSchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class MeasurementSetFieldsDto extends createZodDto(measurementSetFieldsSchema) {}
export class MeasurementSetDto extends createZodDto(measurementSetSchema) {}
export class MeasurementCsvReadingDto extends createZodDto(measurementCsvReadingSchema) {}
export class MeasurementSetQueryDto extends createZodDto(measurementSetQuerySchema) {}
