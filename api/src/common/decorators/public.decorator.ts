import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC_KEY = 'shuntwise:isPublic';

/** Marks a route as open to anyone. Every other route needs a valid token and @Roles. */
export const Public = () => SetMetadata(IS_PUBLIC_KEY, true);
