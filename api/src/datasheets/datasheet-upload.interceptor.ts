import {
  BadRequestException,
  Inject,
  Injectable,
  PayloadTooLargeException,
  type CallHandler,
  type ExecutionContext,
  type NestInterceptor,
} from '@nestjs/common';
import type { Request, RequestHandler, Response } from 'express';
import multer, { MulterError } from 'multer';
import { ENV, type Env } from '../config/env';

/** C0 and C1 control characters (and DEL): no file name has a reason to carry them. */
// eslint-disable-next-line no-control-regex
const CONTROL_CHARACTER = /[\u0000-\u001f\u007f-\u009f]/;

/**
 * Multer with memory storage for `POST /datasheets`: one file in the field `file`, at most
 * UPLOAD_MAX_BYTES. Its errors become plain 4xx messages. Nothing touches the disk.
 */
@Injectable()
export class DatasheetUploadInterceptor implements NestInterceptor {
  private readonly upload: RequestHandler;
  private readonly limit: number;
  /** What the one file is, for the messages (a subclass for other uploads says so). */
  protected readonly fileWord: string = 'PDF';

  constructor(@Inject(ENV) env: Env) {
    this.limit = env.UPLOAD_MAX_BYTES;
    this.upload = multer({
      storage: multer.memoryStorage(),
      limits: { fileSize: env.UPLOAD_MAX_BYTES, files: 1, fields: 10, fieldSize: 10_000, parts: 12 },
      // File names from browsers are UTF-8; multer's default latin1 would garble "Datenblatt-µ.pdf".
      defParamCharset: 'utf8',
    }).single('file');
  }

  async intercept(context: ExecutionContext, next: CallHandler) {
    const http = context.switchToHttp();
    const req = http.getRequest<Request>();
    await new Promise<void>((resolve, reject) =>
      this.upload(req, http.getResponse<Response>(), (error: unknown) => (error ? reject(this.describe(error)) : resolve())),
    );
    const name = req.file?.originalname;
    if (name !== undefined && CONTROL_CHARACTER.test(name)) {
      throw new BadRequestException({
        message: 'The file name contains control characters; rename the file and upload it again',
        errors: [{ path: 'file', message: 'file name contains control characters' }],
      });
    }
    return next.handle();
  }

  private describe(error: unknown): unknown {
    if (!(error instanceof MulterError)) {
      const message = (error as Error)?.message ?? '';
      // busboy refuses a part header with control bytes (e.g. in the file name) as malformed.
      if (/malformed part header/i.test(message)) {
        return new BadRequestException({
          message: 'The upload form has a malformed part header: the file name may not contain control characters',
          errors: [{ path: 'file', message: 'file name or part header contains characters a header cannot carry' }],
        });
      }
      if (/multipart|boundary|unexpected end|malformed/i.test(message))
        return new BadRequestException(`The upload is not a complete multipart form (${message}); send the ${this.fileWord} in the field "file"`);
      return error;
    }
    switch (error.code) {
      case 'LIMIT_FILE_SIZE':
        return new PayloadTooLargeException(`The file is larger than the upload limit of ${megabytes(this.limit)}: nothing was stored`);
      case 'LIMIT_UNEXPECTED_FILE':
        return new BadRequestException(
          error.field === 'file' ? 'Send one file per upload' : `Send the ${this.fileWord} in the multipart field "file" (it came in "${error.field ?? '?'}")`,
        );
      case 'LIMIT_FILE_COUNT':
        return new BadRequestException('Send one file per upload');
      default:
        return new BadRequestException(`The upload form is not acceptable: ${error.message}`);
    }
  }
}

function megabytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${+(bytes / (1024 * 1024)).toFixed(1)} MB` : `${Math.round(bytes / 1024)} kB`;
}
