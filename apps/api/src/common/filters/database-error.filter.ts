import { type ArgumentsHost, Catch, type ExceptionFilter, HttpStatus, Logger } from '@nestjs/common';
import { type Response } from 'express';
import { QueryFailedError } from 'typeorm';

/**
 * Turns constraint violations that slipped past the services' own checks into 409 Conflict
 * instead of 500; anything else stays a 500 without internals in the body.
 */
@Catch(QueryFailedError)
export class DatabaseErrorFilter implements ExceptionFilter {
  private readonly logger = new Logger(DatabaseErrorFilter.name);

  catch(error: QueryFailedError, host: ArgumentsHost): void {
    const res = host.switchToHttp().getResponse<Response>();
    const message = error.message;
    // SQLite says it in the message; PostgreSQL gives an SQLSTATE code (Appendix A of its manual).
    const code = (error.driverError as { code?: unknown } | undefined)?.code;
    if (code === '40001' || code === '40P01') {
      // A serializable transaction that still conflicted after its retries (postgres-transactions.ts).
      res.status(HttpStatus.CONFLICT).json({
        statusCode: 409,
        error: 'Conflict',
        message: 'The data changed while this request ran: try again',
      });
      return;
    }
    if (/UNIQUE constraint failed/i.test(message) || code === '23505') {
      res
        .status(HttpStatus.CONFLICT)
        .json({ statusCode: 409, error: 'Conflict', message: 'A record with these values already exists' });
      return;
    }
    if (/FOREIGN KEY constraint failed/i.test(message) || code === '23503') {
      res.status(HttpStatus.CONFLICT).json({
        statusCode: 409,
        error: 'Conflict',
        message: 'The record is referenced by other records or refers to a missing one',
      });
      return;
    }
    this.logger.error(message, error.stack);
    res
      .status(HttpStatus.INTERNAL_SERVER_ERROR)
      .json({ statusCode: 500, error: 'Internal Server Error', message: 'Internal server error' });
  }
}
