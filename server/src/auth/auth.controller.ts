import {
  Body,
  Controller,
  Get,
  HttpCode,
  Post,
  Req,
  Res,
  UnauthorizedException,
  UseGuards,
} from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import {
  ChangePasswordRequest,
  CSRF_HEADER,
  LoginRequest,
  type LoginResponse,
  type SessionUser,
} from '@stormhour/shared';
import type { Request, Response } from 'express';
import { AnyRole, CurrentUser, Public } from '../common/access.decorators.js';
import { jsonSchema } from '../common/openapi.js';
import { zodBody } from '../common/zod-validation.pipe.js';
import { AuthService, type IssuedSession } from './auth.service.js';
import { LoginThrottleGuard } from './login-throttle.guard.js';

/**
 * The access token travels in the response body and lives only in the page's memory; the refresh
 * token is an httpOnly, SameSite=Strict cookie scoped to /api/auth that scripts cannot read.
 */
export const REFRESH_COOKIE = 'stormhour_refresh';
const COOKIE_PATH = '/api/auth';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(private readonly auth: AuthService) {}

  @Post('login')
  @Public()
  @HttpCode(200)
  @UseGuards(LoginThrottleGuard)
  @ApiBody({ schema: jsonSchema(LoginRequest) })
  async login(
    @Body(zodBody(LoginRequest)) body: LoginRequest,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ): Promise<LoginResponse> {
    return this.withCookie(await this.auth.login(body), req, res);
  }

  @Post('refresh')
  @Public()
  @HttpCode(200)
  async refresh(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<LoginResponse> {
    // A cross-site page can make the browser send the cookie, but cannot add a custom header.
    if (!req.get(CSRF_HEADER)) throw new UnauthorizedException(`The ${CSRF_HEADER} header is required.`);
    return this.withCookie(await this.auth.refresh(req.cookies?.[REFRESH_COOKIE]), req, res);
  }

  @Post('logout')
  @AnyRole()
  @HttpCode(204)
  @ApiBearerAuth()
  async logout(
    @CurrentUser() user: SessionUser,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ) {
    await this.auth.logout(user, req.cookies?.[REFRESH_COOKIE]);
    res.clearCookie(REFRESH_COOKIE, { path: COOKIE_PATH });
  }

  @Get('me')
  @AnyRole()
  @ApiBearerAuth()
  me(@CurrentUser() user: SessionUser): SessionUser {
    return user;
  }

  @Post('password')
  @AnyRole()
  @HttpCode(204)
  @ApiBearerAuth()
  @ApiBody({ schema: jsonSchema(ChangePasswordRequest) })
  changePassword(
    @CurrentUser() user: SessionUser,
    @Body(zodBody(ChangePasswordRequest)) body: ChangePasswordRequest,
  ) {
    return this.auth.changePassword(user, body);
  }

  private withCookie(session: IssuedSession, req: Request, res: Response): LoginResponse {
    res.cookie(REFRESH_COOKIE, session.refreshToken, {
      httpOnly: true,
      sameSite: 'strict',
      secure: req.secure,
      path: COOKIE_PATH,
      expires: session.refreshExpires,
    });
    const { refreshToken: _r, refreshExpires: _e, ...response } = session;
    return response;
  }
}
