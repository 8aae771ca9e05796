import { Global, Module } from '@nestjs/common';
import { TextIndexRepository } from './text-index.repository';

/** The n-gram text index: every feature that writes or searches names uses the one repository. */
@Global()
@Module({
  providers: [TextIndexRepository],
  exports: [TextIndexRepository],
})
export class TextIndexModule {}
