import { Module } from '@nestjs/common';
import { ZonesModule } from '../zones/zones.module';
import { ReadingsCsvService } from './readings-csv.service';
import { ReadingsController } from './readings.controller';
import { ReadingsRepository } from './readings.repository';
import { ReadingsService } from './readings.service';

@Module({
  imports: [ZonesModule],
  controllers: [ReadingsController],
  providers: [ReadingsService, ReadingsRepository, ReadingsCsvService],
  exports: [ReadingsService, ReadingsRepository],
})
export class ReadingsModule {}
