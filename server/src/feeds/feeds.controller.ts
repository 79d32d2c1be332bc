import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type CreatedFeedKey, type FeedKeyDto } from '@morrowline/shared';
import type { AuthUser } from '../common/auth-user';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { CreateFeedKeyDto, RevokeFeedKeyDto } from './dto/feed-key.dto';
import { FeedKeysService } from './feed-keys.service';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';

@ApiTags('feeds')
@ApiBearerAuth()
@Controller('feeds/keys')
@Roles(...PERMISSIONS.administer)
export class FeedsController {
  constructor(private readonly keys: FeedKeysService) {}

  @Get()
  list(): Promise<FeedKeyDto[]> {
    return this.keys.list();
  }

  /** Answers the key itself once; only its hash is kept. */
  @Post()
  create(@CurrentUser() actor: AuthUser, @Body() body: CreateFeedKeyDto): Promise<CreatedFeedKey> {
    return this.keys.create(actor, body);
  }

  @Post(':id/revoke')
  @HttpCode(200)
  revoke(@CurrentUser() actor: AuthUser, @Param('id', ParseIdPipe) id: number, @Body() body: RevokeFeedKeyDto): Promise<FeedKeyDto> {
    return this.keys.revoke(actor, id, body.reason);
  }
}
