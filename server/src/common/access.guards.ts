import { type CanActivate, type ExecutionContext, ForbiddenException, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import type { Role, SessionUser } from '@stormhour/shared';
import { PUBLIC_KEY, ROLES_KEY } from './access.decorators.js';

function isPublic(reflector: Reflector, ctx: ExecutionContext): boolean {
  return reflector.getAllAndOverride<boolean>(PUBLIC_KEY, [ctx.getHandler(), ctx.getClass()]) === true;
}

/** Global: every route needs a valid access token unless marked @Public(). */
@Injectable()
export class JwtAuthGuard extends AuthGuard('jwt') {
  constructor(private readonly reflector: Reflector) {
    super();
  }

  override canActivate(ctx: ExecutionContext) {
    if (isPublic(this.reflector, ctx)) return true;
    return super.canActivate(ctx);
  }
}

/** Global: a signed-in user passes only if the route names their role. No @Roles() means no one. */
@Injectable()
export class RolesGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(ctx: ExecutionContext): boolean {
    if (isPublic(this.reflector, ctx)) return true;
    const roles = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, [
      ctx.getHandler(),
      ctx.getClass(),
    ]);
    const user = ctx.switchToHttp().getRequest<{ user?: SessionUser }>().user;
    if (!roles || !user || !roles.includes(user.role)) {
      throw new ForbiddenException('Your role does not give access to this.');
    }
    return true;
  }
}
