import { Injectable } from '@nestjs/common';
import { DatasheetUploadInterceptor } from '../datasheets/datasheet-upload.interceptor';

/** The same one-file multipart handling and limits as datasheets, for measurement CSVs. */
@Injectable()
export class MeasurementUploadInterceptor extends DatasheetUploadInterceptor {
  protected override readonly fileWord: string = 'CSV';
}
