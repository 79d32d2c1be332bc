import { Module } from '@nestjs/common';
import { AuthModule } from '../auth/auth.module';
import { DeskGateway } from './desk.gateway';

/** The desks' socket: it hears the domain events and pushes them to desks (nothing injects it). */
@Module({ imports: [AuthModule], providers: [DeskGateway] })
export class DeskModule {}
