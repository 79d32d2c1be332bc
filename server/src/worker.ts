import './cluster/worker-role';
import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { DESK_NAMESPACE } from '@morrowline/shared';
import { AppModule } from './app.module';
import { createDeskRelay } from './cluster/cluster-io.adapter';
import { loadClusterConfig } from './cluster/cluster-config';
import { RefitWorkerHost } from './cluster/refit-worker-host';
import { DeskGateway } from './desk/desk.gateway';

/**
 * A cluster worker (`npm run worker`): the application without HTTP or sockets of its own, taking
 * refit and forecast jobs from the queue on REDIS_URL and writing to the same MariaDB as the
 * nodes. Its domain events reach the desks through the relay (the desk gateway broadcasts through
 * the Redis adapter, as a node's would); start as many as the fits need, on any machine.
 */
async function bootstrap(): Promise<void> {
  const cluster = loadClusterConfig();
  if (!cluster) throw new Error('a worker needs REDIS_URL');
  const app = await NestFactory.createApplicationContext(AppModule);
  app.enableShutdownHooks();
  const relay = await createDeskRelay(cluster);
  app.get(DeskGateway).server = relay.of(DESK_NAMESPACE);
  await app.get(RefitWorkerHost).start();
  Logger.log(`Morrowline worker ${process.pid} taking jobs`, 'Bootstrap');
}

bootstrap().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
