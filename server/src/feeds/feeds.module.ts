import { Module } from '@nestjs/common';
import { ReadingsModule } from '../readings/readings.module';
import { WeatherModule } from '../weather/weather.module';
import { ZonesModule } from '../zones/zones.module';
import { FeedKeysRepository } from './feed-keys.repository';
import { FeedKeysService } from './feed-keys.service';
import { FeedsController } from './feeds.controller';
import { FeedsGateway } from './feeds.gateway';

@Module({
  imports: [ReadingsModule, ZonesModule, WeatherModule],
  controllers: [FeedsController],
  providers: [FeedKeysRepository, FeedKeysService, FeedsGateway],
  exports: [FeedKeysService],
})
export class FeedsModule {}
