import { createParamDecorator, type ExecutionContext, SetMetadata } from '@nestjs/common';
import type { Role, SessionUser } from '@stormhour/shared';

export const PUBLIC_KEY = 'stormhour:public';
export const ROLES_KEY = 'stormhour:roles';

/** Reachable without signing in (sign-in itself, health). */
export const Public = () => SetMetadata(PUBLIC_KEY, true);

/** The roles that may call a route. Routes without it are refused: access is denied by default. */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);

/** Any signed-in user, whatever the role. */
export const AnyRole = () => Roles('admin', 'scientist', 'writer', 'officer');

export const CurrentUser = createParamDecorator((_data: unknown, ctx: ExecutionContext): SessionUser => {
  return ctx.switchToHttp().getRequest<{ user: SessionUser }>().user;
});
