import { Module } from '@nestjs/common';
import { ReadingsModule } from '../readings/readings.module';
import { FeedKeysService } from './feed-keys.service';
import { FeedsController } from './feeds.controller';
import { FeedsGateway } from './feeds.gateway';

@Module({
  imports: [ReadingsModule],
  controllers: [FeedsController],
  providers: [FeedKeysService, FeedsGateway],
  exports: [FeedKeysService],
})
export class FeedsModule {}
