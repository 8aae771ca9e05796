import {
  createQualificationRequestSchema,
  qualificationApproveRequestSchema,
  qualificationClearRequestSchema,
  qualificationClearWithConditionsRequestSchema,
  qualificationClearWithWaiverRequestSchema,
  qualificationCommentRequestSchema,
  qualificationEvaluateRequestSchema,
  qualificationListQuerySchema,
  qualificationPageSchema,
  qualificationRecheckRequestSchema,
  qualificationRejectRequestSchema,
  qualificationRevokeRequestSchema,
  qualificationSchema,
  qualificationSendBackRequestSchema,
  qualificationSubmitRequestSchema,
  qualificationWithdrawRequestSchema,
  updateQualificationRequestSchema,
} from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class QualificationListQueryDto extends createZodDto(qualificationListQuerySchema) {}
export class QualificationPageDto extends createZodDto(qualificationPageSchema) {}
export class QualificationDto extends createZodDto(qualificationSchema) {}
export class CreateQualificationDto extends createZodDto(createQualificationRequestSchema) {}
export class UpdateQualificationDto extends createZodDto(updateQualificationRequestSchema) {}
export class EvaluateDto extends createZodDto(qualificationEvaluateRequestSchema) {}
export class SubmitDto extends createZodDto(qualificationSubmitRequestSchema) {}
export class SendBackDto extends createZodDto(qualificationSendBackRequestSchema) {}
export class ApproveDto extends createZodDto(qualificationApproveRequestSchema) {}
export class ClearDto extends createZodDto(qualificationClearRequestSchema) {}
export class ClearWithConditionsDto extends createZodDto(qualificationClearWithConditionsRequestSchema) {}
export class ClearWithWaiverDto extends createZodDto(qualificationClearWithWaiverRequestSchema) {}
export class RejectDto extends createZodDto(qualificationRejectRequestSchema) {}
export class WithdrawDto extends createZodDto(qualificationWithdrawRequestSchema) {}
export class RevokeDto extends createZodDto(qualificationRevokeRequestSchema) {}
export class RecheckDto extends createZodDto(qualificationRecheckRequestSchema) {}
export class CommentDto extends createZodDto(qualificationCommentRequestSchema) {}
