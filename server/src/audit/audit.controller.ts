import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type AuditEntryDto, type Page } from '@morrowline/shared';
import { Roles } from '../common/decorators/roles.decorator';
import { AuditService } from './audit.service';
import { AuditQueryDto } from './dto/audit-query.dto';

@ApiTags('audit')
@ApiBearerAuth()
@Controller('audit')
export class AuditController {
  constructor(private readonly audit: AuditService) {}

  @Get()
  @Roles(...PERMISSIONS.readAudit)
  list(@Query() query: AuditQueryDto): Promise<Page<AuditEntryDto>> {
    return this.audit.list(query);
  }
}
