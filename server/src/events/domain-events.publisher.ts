import { Injectable } from '@nestjs/common';
import { EventEmitter2 } from '@nestjs/event-emitter';
import type { DomainEventName, DomainEventPayloads } from './domain-events';

/**
 * Where services announce what happened. Call it after the transaction has committed, never
 * inside one: a listener must not hear of a change that may still roll back. Listeners run
 * synchronously in `publish`; one that throws is logged by the event emitter and does not reach
 * the publisher (`suppressErrors`, the default of @OnEvent).
 */
@Injectable()
export class DomainEventsPublisher {
  constructor(private readonly emitter: EventEmitter2) {}

  publish<K extends DomainEventName>(name: K, payload: DomainEventPayloads[K]): void {
    this.emitter.emit(name, payload);
  }
}
