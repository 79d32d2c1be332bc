import { BadRequestException, Body, Controller, Get, Header, Param, Post, Put, Query, UploadedFile, UseInterceptors } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiConsumes, ApiTags } from '@nestjs/swagger';
import {
  CSV_MAX_BYTES,
  HOUR_MS,
  PERMISSIONS,
  type WeatherCsvReport,
  type WeatherStationDto,
  type WeatherStatusDto,
  type ZoneStationsDto,
  type ZoneWeatherSeriesDto,
} from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles, SignedIn } from '../common/decorators/roles.decorator';
import { CreateWeatherStationDto, WeatherExportQueryDto, ZoneStationWeightsDto, ZoneWeatherQueryDto } from './dto/weather.dto';
import { WeatherCsvService } from './weather-csv.service';
import { WeatherService } from './weather.service';

interface UploadedCsv {
  originalname: string;
  buffer: Buffer;
}

/** Longest span one download may cover: 800 days, as readings. */
const MAX_EXPORT_MS = 800 * 24 * HOUR_MS;

function exportRange(query: WeatherExportQueryDto): { from: number; to: number } {
  const to = query.to?.getTime() ?? Date.now();
  const from = query.from?.getTime() ?? to - 31 * 24 * HOUR_MS;
  if (!(from < to)) throw new BadRequestException('from must be before to');
  if (to - from > MAX_EXPORT_MS) throw new BadRequestException('A download may span at most 800 days');
  return { from, to };
}

@ApiTags('weather')
@ApiBearerAuth()
@Controller('weather')
export class WeatherController {
  constructor(
    private readonly weather: WeatherService,
    private readonly csv: WeatherCsvService,
  ) {}

  @Get('stations')
  @SignedIn()
  stations(): Promise<WeatherStationDto[]> {
    return this.weather.stations();
  }

  @Post('stations')
  @Roles(...PERMISSIONS.administer)
  createStation(@CurrentUser() actor: AuthUser, @Body() body: CreateWeatherStationDto): Promise<WeatherStationDto> {
    return this.weather.createStation(actor, body);
  }

  @Get('zone-stations')
  @SignedIn()
  zoneStations(): Promise<ZoneStationsDto[]> {
    return this.weather.zoneStations();
  }

  /** Which stations make a zone's temperature, and their weights (replaces the zone's list). */
  @Put('zone-stations/:zone')
  @Roles(...PERMISSIONS.administer)
  setZoneStations(@CurrentUser() actor: AuthUser, @Param('zone') zone: string, @Body() body: ZoneStationWeightsDto): Promise<ZoneStationsDto> {
    return this.weather.setZoneStations(actor, zone, body);
  }

  /** Per zone and hour: observed temperature and the forecast as known at `asOf`. */
  @Get('zones')
  @SignedIn()
  zones(@Query() query: ZoneWeatherQueryDto): Promise<ZoneWeatherSeriesDto> {
    return this.weather.zoneSeries(query.zone, query.from, query.to, query.asOf);
  }

  /** Per station: latest observed hour, latest forecast, stale flags. */
  @Get('status')
  @SignedIn()
  status(): Promise<WeatherStatusDto[]> {
    return this.weather.status();
  }

  /** CSV, multipart field `file`: `timestamp,station,temp_c`. */
  @Post('observed/upload')
  @Roles(...PERMISSIONS.forecast)
  @ApiConsumes('multipart/form-data')
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: CSV_MAX_BYTES, files: 1 } }))
  uploadObserved(@CurrentUser() actor: AuthUser, @UploadedFile() file: UploadedCsv | undefined): Promise<WeatherCsvReport> {
    if (!file) throw new BadRequestException('Attach the CSV file as the multipart field "file"');
    return this.csv.upload(actor, 'observed', file.originalname, file.buffer);
  }

  /** CSV, multipart field `file`: `issued_at,timestamp,station,temp_c[,member]`. */
  @Post('forecasts/upload')
  @Roles(...PERMISSIONS.forecast)
  @ApiConsumes('multipart/form-data')
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: CSV_MAX_BYTES, files: 1 } }))
  uploadForecasts(@CurrentUser() actor: AuthUser, @UploadedFile() file: UploadedCsv | undefined): Promise<WeatherCsvReport> {
    if (!file) throw new BadRequestException('Attach the CSV file as the multipart field "file"');
    return this.csv.upload(actor, 'forecasts', file.originalname, file.buffer);
  }

  @Get('observed/export')
  @SignedIn()
  @Header('Content-Type', 'text/csv; charset=utf-8')
  @Header('Content-Disposition', 'attachment; filename="temperature-observed.csv"')
  exportObserved(@Query() query: WeatherExportQueryDto): Promise<string> {
    const range = exportRange(query);
    return this.csv.downloadObserved(query.station, range.from, range.to);
  }

  @Get('forecasts/export')
  @SignedIn()
  @Header('Content-Type', 'text/csv; charset=utf-8')
  @Header('Content-Disposition', 'attachment; filename="temperature-forecasts.csv"')
  exportForecasts(@Query() query: WeatherExportQueryDto): Promise<string> {
    const range = exportRange(query);
    return this.csv.downloadForecasts(query.station, range.from, range.to);
  }
}
