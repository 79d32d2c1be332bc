import { Global, Module } from '@nestjs/common';
import { AuthModule } from '../auth/auth.module';
import { DeskGateway } from './desk.gateway';

/** Global: features push to desks through DeskGateway.broadcast. */
@Global()
@Module({ imports: [AuthModule], providers: [DeskGateway], exports: [DeskGateway] })
export class DeskModule {}
