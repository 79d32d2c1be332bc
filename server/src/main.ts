import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { AppModule } from './app.module';
import { ClusterIoAdapter } from './cluster/cluster-io.adapter';
import { loadClusterConfig } from './cluster/cluster-config';
import { configureApp } from './app.setup';
import { loadConfig } from './config/configuration';

async function bootstrap(): Promise<void> {
  const config = loadConfig();
  const app = await NestFactory.create<NestExpressApplication>(AppModule, { bufferLogs: false });
  configureApp(app, config);
  // Cluster mode: desks on every node hear what any node or worker publishes (the Redis adapter).
  const cluster = loadClusterConfig();
  if (cluster) app.useWebSocketAdapter(await ClusterIoAdapter.create(app, cluster));
  await app.listen(config.port, config.host);
  Logger.log(`Morrowline listening on http://${config.host}:${config.port}`, 'Bootstrap');
}

bootstrap().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
