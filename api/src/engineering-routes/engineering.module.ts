import { Module } from '@nestjs/common';
import { EngineeringController } from './engineering.controller';

/** HTTP face of the pure engineering core; other features import the core's functions directly. */
@Module({ controllers: [EngineeringController] })
export class EngineeringModule {}
