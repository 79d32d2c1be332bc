import { Module } from '@nestjs/common';
import { ComputeService } from './compute.service';

/** The worker-thread pool for the engine; import it where heavy computation is needed. */
@Module({ providers: [ComputeService], exports: [ComputeService] })
export class ComputeModule {}
