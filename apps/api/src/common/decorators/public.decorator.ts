import { applyDecorators, SetMetadata } from '@nestjs/common';

export const IS_PUBLIC_KEY = 'rotaplex:public';

/** Opts a route out of the global JWT guard. Every other route needs a valid access token. */
export const Public = () => applyDecorators(SetMetadata(IS_PUBLIC_KEY, true));
