import { Global, Module } from '@nestjs/common';
import { EventEmitterModule } from '@nestjs/event-emitter';
import { DomainEventsPublisher } from './domain-events.publisher';

/** Global: every feature may publish domain events; listeners subscribe with @OnEvent. */
@Global()
@Module({ imports: [EventEmitterModule.forRoot()], providers: [DomainEventsPublisher], exports: [DomainEventsPublisher] })
export class EventsModule {}
