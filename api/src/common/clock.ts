import { Global, Injectable, Module } from '@nestjs/common';

/**
 * The time the app goes by where a rule depends on the date (waiver expiry). One provider,
 * so a test can move it (`jest.spyOn(app.get(Clock), 'now')`) and prove what happens then.
 */
@Injectable()
export class Clock {
  now(): Date {
    return new Date();
  }
}

@Global()
@Module({ providers: [Clock], exports: [Clock] })
export class ClockModule {}
