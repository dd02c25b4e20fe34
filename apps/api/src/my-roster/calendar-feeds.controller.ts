import { Controller, Get, Header, NotFoundException, Param } from '@nestjs/common';
import { ApiNotFoundResponse, ApiOkResponse, ApiOperation, ApiParam, ApiTags } from '@nestjs/swagger';
import { ApiErrorResponse } from '../common/api-error.dto';
import { Public } from '../common/decorators/public.decorator';
import { CalendarFeedsService } from './calendar-feeds.service';

/** The feeds calendar programs subscribe to: no sign-in, the secret in the URL is the key. */
@ApiTags('my roster')
@Controller('calendar-feeds')
export class CalendarFeedsController {
  constructor(private readonly feeds: CalendarFeedsService) {}

  @Get(':file')
  @Public()
  @Header('Content-Type', 'text/calendar; charset=utf-8')
  @Header('Content-Disposition', 'inline; filename="rotaplex.ics"')
  @Header('Cache-Control', 'private, no-cache')
  @ApiOperation({ summary: 'An iCalendar feed (RFC 5545) by its secret token' })
  @ApiParam({ name: 'file', description: 'The token followed by .ics', example: '<token>.ics' })
  @ApiOkResponse({
    description: 'text/calendar',
    content: { 'text/calendar': { schema: { type: 'string' } } },
  })
  @ApiNotFoundResponse({ type: ApiErrorResponse, description: 'Unknown or regenerated token' })
  feed(@Param('file') file: string): Promise<string> {
    if (!file.endsWith('.ics')) throw new NotFoundException('No calendar feed at this address');
    return this.feeds.render(file.slice(0, -'.ics'.length));
  }
}
