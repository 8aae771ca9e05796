import {
  createVendorPartRequestSchema,
  manufacturerSchema,
  putRatingCardRequestSchema,
  ratingCardConflictSchema,
  ratingCardQuerySchema,
  ratingCardVersionSummarySchema,
  ratingCardViewSchema,
  updateVendorPartRequestSchema,
  vendorPartDetailSchema,
  vendorPartListQuerySchema,
  vendorPartModelSchema,
  vendorPartPageSchema,
} from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class VendorPartListQueryDto extends createZodDto(vendorPartListQuerySchema) {}
export class CreateVendorPartDto extends createZodDto(createVendorPartRequestSchema) {}
export class UpdateVendorPartDto extends createZodDto(updateVendorPartRequestSchema) {}
export class RatingCardQueryDto extends createZodDto(ratingCardQuerySchema) {}
export class PutRatingCardDto extends createZodDto(putRatingCardRequestSchema) {}

export class VendorPartPageDto extends createZodDto(vendorPartPageSchema) {}
export class VendorPartDetailDto extends createZodDto(vendorPartDetailSchema) {}
export class ManufacturerDto extends createZodDto(manufacturerSchema) {}
export class RatingCardViewDto extends createZodDto(ratingCardViewSchema) {}
export class RatingCardConflictDto extends createZodDto(ratingCardConflictSchema) {}
export class RatingCardVersionSummaryDto extends createZodDto(ratingCardVersionSummarySchema) {}
export class VendorPartModelDto extends createZodDto(vendorPartModelSchema) {}
