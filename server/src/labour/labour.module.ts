import { Global, Module } from '@nestjs/common';
import { LabourService } from './labour.service.js';

@Global()
@Module({ providers: [LabourService], exports: [LabourService] })
export class LabourModule {}
