/** Accounts: signing in and up, tokens, passwords. */
import type { Id } from './common';

export interface User {
  id: Id;
  email: string;
  name: string;
}

export interface SignInRequest {
  email: string;
  password: string;
}

/** Sign-in, refresh, sign-up and accepting an invitation all answer this, and set the `osm_refresh` cookie. */
export interface SignInResponse {
  /** Access token for `Authorization: Bearer`; short-lived (15 minutes): refresh before it ends. */
  token: string;
  user: User;
  /** Seconds until the access token expires (added field). */
  expiresIn?: number;
}

export interface SignUpRequest {
  email: string;
  name: string;
  password: string;
}

export interface ChangePasswordRequest {
  currentPassword: string;
  newPassword: string;
}

export interface ResetRequestRequest {
  email: string;
}

export interface ResetPasswordRequest {
  token: string;
  newPassword: string;
}

/** Passwords: 8 to 72 bytes (bcrypt reads no further). */
export const PASSWORD_MIN_LENGTH = 8;
export const PASSWORD_MAX_BYTES = 72;
