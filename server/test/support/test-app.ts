import { Test } from '@nestjs/testing';
import type { NestExpressApplication } from '@nestjs/platform-express';
import type { Role } from '@morrowline/shared';
import { DEMO_USERS } from '@morrowline/shared';
import request from 'supertest';
import { AppModule } from '../../src/app.module';
import { configureApp } from '../../src/app.setup';
import { loadConfig } from '../../src/config/configuration';

/** The real application (real MariaDB, real guards), listening on a free loopback port. */
export async function startTestApp(): Promise<NestExpressApplication> {
  const moduleRef = await Test.createTestingModule({ imports: [AppModule] }).compile();
  const app = moduleRef.createNestApplication<NestExpressApplication>({ logger: ['error'] });
  configureApp(app, loadConfig());
  await app.listen(0, '127.0.0.1');
  return app;
}

export function demoUser(role: Role) {
  const user = DEMO_USERS.find((u) => u.role === role);
  if (!user) throw new Error(`no demo user with role ${role}`);
  return user;
}

/** Signs in as the first demo user of a role and answers its bearer token. */
export async function tokenFor(app: NestExpressApplication, role: Role): Promise<string> {
  const user = demoUser(role);
  const response = await request(app.getHttpServer()).post('/api/auth/login').send({ email: user.email, password: user.password }).expect(200);
  return (response.body as { accessToken: string }).accessToken;
}

export function baseUrl(app: NestExpressApplication): string {
  const address = app.getHttpServer().address() as { port: number };
  return `http://127.0.0.1:${address.port}`;
}
