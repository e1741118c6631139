import { z } from 'zod';
import { ROLES } from './roles.js';

export const LoginRequest = z.object({
  email: z.string().trim().toLowerCase().email('Enter an e-mail address such as name@unit.example'),
  password: z.string().min(1, 'Enter your password'),
});
export type LoginRequest = z.infer<typeof LoginRequest>;

export const SessionUser = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  districtId: z.number().int().nullable(),
});
export type SessionUser = z.infer<typeof SessionUser>;

export interface LoginResponse {
  accessToken: string;
  /** Seconds until the access token expires; the client refreshes before then. */
  expiresIn: number;
  user: SessionUser;
}

/** Passwords: long enough to resist guessing; no composition rules (they push people to weak patterns). */
export const NewPassword = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters');

export const ChangePasswordRequest = z.object({
  currentPassword: z.string().min(1, 'Enter your current password'),
  newPassword: NewPassword,
});
export type ChangePasswordRequest = z.infer<typeof ChangePasswordRequest>;

/** Header the client sends on cookie-authenticated calls; a cross-site form cannot set it. */
export const CSRF_HEADER = 'x-stormhour-csrf';
