import { Module } from '@nestjs/common';
import { ZonesModule } from '../zones/zones.module';
import { WeatherCsvService } from './weather-csv.service';
import { WeatherController } from './weather.controller';
import { WeatherRepository } from './weather.repository';
import { WeatherService } from './weather.service';

@Module({
  imports: [ZonesModule],
  controllers: [WeatherController],
  providers: [WeatherService, WeatherRepository, WeatherCsvService],
  exports: [WeatherService, WeatherRepository],
})
export class WeatherModule {}
