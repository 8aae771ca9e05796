import {
  createVendorPartRequestSchema,
  putRatingCardRequestSchema,
  ratingCardQuerySchema,
  updateVendorPartRequestSchema,
  vendorPartListQuerySchema,
} from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class VendorPartListQueryDto extends createZodDto(vendorPartListQuerySchema) {}
export class CreateVendorPartDto extends createZodDto(createVendorPartRequestSchema) {}
export class UpdateVendorPartDto extends createZodDto(updateVendorPartRequestSchema) {}
export class RatingCardQueryDto extends createZodDto(ratingCardQuerySchema) {}
export class PutRatingCardDto extends createZodDto(putRatingCardRequestSchema) {}
