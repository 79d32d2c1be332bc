import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type AccuracyReportDto } from '@morrowline/shared';
import { Roles } from '../common/decorators/roles.decorator';
import { AccuracyQueryDto } from './dto/accuracy-query.dto';
import { AccuracyService } from './accuracy.service';

@ApiTags('accuracy')
@ApiBearerAuth()
@Controller('accuracy')
export class AccuracyController {
  constructor(private readonly accuracy: AccuracyService) {}

  /** MAPE, MAE, bias and peak-hour error per day, hour ending and zone, model and schedule. */
  @Get()
  @Roles(...PERMISSIONS.readForecasts)
  report(@Query() query: AccuracyQueryDto): Promise<AccuracyReportDto> {
    return this.accuracy.report(query.zone, query.from, query.to);
  }
}
