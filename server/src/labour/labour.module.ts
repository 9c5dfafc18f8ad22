import { Global, Module } from '@nestjs/common';
import { LabourService } from './labour.service.js';
import { LineAccessService } from './line-access.service.js';

@Global()
@Module({ providers: [LabourService, LineAccessService], exports: [LabourService, LineAccessService] })
export class LabourModule {}
