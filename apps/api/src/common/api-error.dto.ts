import { ApiProperty } from '@nestjs/swagger';
import { type ApiError } from '@rotaplex/contracts';

/** OpenAPI shape of every error body (Nest's default exception body). */
export class ApiErrorResponse implements ApiError {
  @ApiProperty({ example: 400 }) statusCode!: number;
  @ApiProperty({ example: 'Bad Request' }) error!: string;
  @ApiProperty({
    oneOf: [{ type: 'string' }, { type: 'array', items: { type: 'string' } }],
    example: ['email must be an e-mail address'],
  })
  message!: string | string[];
}
