import { type ArgumentMetadata, BadRequestException, Injectable, ParseUUIDPipe } from '@nestjs/common';

/**
 * Nest's UUID check for route parameters, with a refusal that names the parameter:
 * "id must be a UUID" instead of "Validation failed (uuid is expected)". Use it as
 * `@Param('id', ParseIdPipe)` on every id in a path.
 */
@Injectable()
export class ParseIdPipe extends ParseUUIDPipe {
  constructor() {
    super({ exceptionFactory: () => new BadRequestException() });
  }

  override async transform(value: string, metadata: ArgumentMetadata): Promise<string> {
    try {
      return await super.transform(value, metadata);
    } catch {
      throw new BadRequestException([`${metadata.data ?? 'id'} must be a UUID`]);
    }
  }
}
