import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { APP_GUARD } from '@nestjs/core';
import { JwtModule } from '@nestjs/jwt';
import { PassportModule } from '@nestjs/passport';
import { ThrottlerModule } from '@nestjs/throttler';
import type { AppConfig } from '../config/configuration';
import { UsersModule } from '../users/users.module';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { JwtAuthGuard } from './guards/jwt-auth.guard';
import { SIGN_IN_TRACKERS } from './guards/login-throttler.guard';
import { RolesGuard } from './guards/roles.guard';
import { JwtStrategy } from './jwt.strategy';
import { SocketAuthService } from './socket-auth.service';

@Module({
  imports: [
    UsersModule,
    PassportModule,
    JwtModule.registerAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService) => ({
        secret: config.getOrThrow<AppConfig>('app').jwt.secret,
        signOptions: { algorithm: 'HS256' },
      }),
    }),
    ThrottlerModule.forRootAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService) => {
        const app = config.getOrThrow<AppConfig>('app');
        return [
          { name: 'login', ttl: 60_000, limit: app.loginAttemptsPerMinute, getTracker: SIGN_IN_TRACKERS['login'] },
          { name: 'login-email', ttl: 60_000, limit: app.loginAttemptsPerMinute, getTracker: SIGN_IN_TRACKERS['login-email'] },
          { name: 'login-address', ttl: 60_000, limit: app.loginAttemptsPerAddressPerMinute, getTracker: SIGN_IN_TRACKERS['login-address'] },
        ];
      },
    }),
  ],
  controllers: [AuthController],
  providers: [
    AuthService,
    JwtStrategy,
    SocketAuthService,
    { provide: APP_GUARD, useClass: JwtAuthGuard },
    { provide: APP_GUARD, useClass: RolesGuard },
  ],
  exports: [SocketAuthService],
})
export class AuthModule {}
