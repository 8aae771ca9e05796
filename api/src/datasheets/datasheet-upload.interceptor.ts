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
    await new Promise<void>((resolve, reject) =>
      this.upload(http.getRequest<Request>(), http.getResponse<Response>(), (error: unknown) => (error ? reject(this.describe(error)) : resolve())),
    );
    return next.handle();
  }

  private describe(error: unknown): unknown {
    if (!(error instanceof MulterError)) {
      const message = (error as Error)?.message ?? '';
      if (/multipart|boundary|unexpected end/i.test(message)) return new BadRequestException(`The upload is not a complete multipart form (${message}); send the ${this.fileWord} in the field "file"`);
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
