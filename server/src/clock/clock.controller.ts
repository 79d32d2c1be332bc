import { Controller, Get } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { DeskClockDto } from '@morrowline/shared';
import { SignedIn } from '../common/decorators/roles.decorator';
import type { AppConfig } from '../config/configuration';

/** The desk's time zone, so every screen writes moments that belong to no load zone in one clock. */
@ApiTags('clock')
@ApiBearerAuth()
@Controller('clock')
export class ClockController {
  private readonly deskTimeZone: string;

  constructor(config: ConfigService) {
    this.deskTimeZone = config.getOrThrow<AppConfig>('app').shifts.timeZone;
  }

  @Get()
  @SignedIn()
  clock(): DeskClockDto {
    return { deskTimeZone: this.deskTimeZone };
  }
}
