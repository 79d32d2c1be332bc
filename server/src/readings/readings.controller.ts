import { BadRequestException, Controller, Get, Header, Post, Query, UploadedFile, UseInterceptors } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiConsumes, ApiTags } from '@nestjs/swagger';
import { CSV_MAX_BYTES, PERMISSIONS, type CsvUploadReport, type FeedStatusDto, type ReadingSeriesDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles, SignedIn } from '../common/decorators/roles.decorator';
import { ReadingsExportQueryDto, ReadingsQueryDto, ReadingsUploadQueryDto } from './dto/readings-query.dto';
import { ReadingsCsvService } from './readings-csv.service';
import { ReadingsService } from './readings.service';

/** What multer hands over for an in-memory upload (the part used here). */
interface UploadedCsv {
  originalname: string;
  buffer: Buffer;
}

@ApiTags('readings')
@ApiBearerAuth()
@Controller('readings')
export class ReadingsController {
  constructor(
    private readonly readings: ReadingsService,
    private readonly csv: ReadingsCsvService,
  ) {}

  /** Hourly series per zone (null where missing) with each zone's latest stored hour. */
  @Get()
  @SignedIn()
  series(@Query() query: ReadingsQueryDto): Promise<ReadingSeriesDto> {
    return this.readings.series(query.zone, query.from, query.to);
  }

  /** Per zone: latest hour stored and whether the feed is stale. */
  @Get('status')
  @SignedIn()
  status(): Promise<FeedStatusDto[]> {
    return this.readings.status();
  }

  @Get('export')
  @SignedIn()
  @Header('Content-Type', 'text/csv; charset=utf-8')
  @Header('Content-Disposition', 'attachment; filename="readings.csv"')
  export(@Query() query: ReadingsExportQueryDto): Promise<string> {
    return this.csv.download(query.zone, query.from, query.to);
  }

  /** CSV history, multipart field `file`: `timestamp,load_mw[,zone]`. */
  @Post('upload')
  @Roles(...PERMISSIONS.forecast)
  @ApiConsumes('multipart/form-data')
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: CSV_MAX_BYTES, files: 1 } }))
  upload(@CurrentUser() actor: AuthUser, @Query() query: ReadingsUploadQueryDto, @UploadedFile() file: UploadedCsv | undefined): Promise<CsvUploadReport> {
    if (!file) throw new BadRequestException('Attach the CSV file as the multipart field "file"');
    return this.csv.upload(actor, file.originalname, file.buffer, query.zone);
  }
}
