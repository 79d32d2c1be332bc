import { MariaDbDriver } from '@mikro-orm/mariadb';
import { MikroOrmModule } from '@mikro-orm/nestjs';
import { Module } from '@nestjs/common';
import { ConfigModule, ConfigService } from '@nestjs/config';
import { ScheduleModule } from '@nestjs/schedule';
import { AccuracyModule } from './accuracy/accuracy.module';
import { AlertsModule } from './alerts/alerts.module';
import { AuditModule } from './audit/audit.module';
import { ClockModule } from './clock/clock.module';
import { ClusterModule } from './cluster/cluster.module';
import { AuthModule } from './auth/auth.module';
import { configFactory, type AppConfig } from './config/configuration';
import { ormConfig } from './database/mikro-orm.config';
import { DeskModule } from './desk/desk.module';
import { EventsModule } from './events/events.module';
import { FeedsModule } from './feeds/feeds.module';
import { HandoverModule } from './handover/handover.module';
import { ForecastsModule } from './forecasts/forecasts.module';
import { HealthModule } from './health/health.module';
import { LiveModule } from './live/live.module';
import { ModelsModule } from './models/models.module';
import { OutagesModule } from './outages/outages.module';
import { ReadingsModule } from './readings/readings.module';
import { SchedulesModule } from './schedules/schedules.module';
import { UsersModule } from './users/users.module';
import { WorkbenchModule } from './workbench/workbench.module';
import { CalendarModule } from './calendar/calendar.module';
import { WeatherModule } from './weather/weather.module';
import { ZonesModule } from './zones/zones.module';

@Module({
  imports: [
    ConfigModule.forRoot({ isGlobal: true, ignoreEnvFile: true, load: [configFactory] }),
    MikroOrmModule.forRootAsync({
      inject: [ConfigService],
      driver: MariaDbDriver,
      useFactory: (config: ConfigService) => ormConfig(config.getOrThrow<AppConfig>('app')),
    }),
    ScheduleModule.forRoot(),
    EventsModule,
    AuditModule,
    AuthModule,
    UsersModule,
    ZonesModule,
    HealthModule,
    ClockModule,
    DeskModule,
    HandoverModule,
    ReadingsModule,
    FeedsModule,
    AlertsModule,
    LiveModule,
    WorkbenchModule,
    OutagesModule,
    ForecastsModule,
    ModelsModule,
    AccuracyModule,
    SchedulesModule,
    WeatherModule,
    CalendarModule,
    // empty without REDIS_URL: one machine needs no Redis
    ClusterModule.forRoot(),
  ],
})
export class AppModule {}
