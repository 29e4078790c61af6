import type { MeResponse, SignUpAccepted } from '@shared/schemas/account-responses'
import type {
  EmailVerificationConfirmInput,
  PasswordChangeInput,
  PasswordResetConfirmInput,
  PasswordResetRequestInput,
  ProfileUpdateInput,
  SignInInput,
  SignUpInput,
} from '@shared/schemas/auth'
import { apiRequest } from './http'

// The accounts API (docs/api.md, "Accounts"); the session itself lives in an HttpOnly cookie.

/** The current session, or null when signed out (200 either way, unlike `GET /auth/me`). */
export const fetchSession = () => apiRequest<{ session: MeResponse | null }>('/v1/auth/session')

export const signIn = (input: SignInInput) =>
  apiRequest<MeResponse>('/v1/auth/sign-in', {
    method: 'POST',
    body: input,
    quietUnauthorized: true,
    writesNothing: true,
  })

/** The same answer whether or not the address had an account; the mail says which. */
export const signUp = (input: SignUpInput) =>
  apiRequest<SignUpAccepted>('/v1/auth/sign-up', { method: 'POST', body: input })

export const signOut = () =>
  apiRequest<void>('/v1/auth/sign-out', { method: 'POST', writesNothing: true })

export const signOutEverywhere = () =>
  apiRequest<void>('/v1/auth/sign-out-everywhere', { method: 'POST', writesNothing: true })

export const updateProfile = (input: ProfileUpdateInput) =>
  apiRequest<MeResponse>('/v1/auth/me', { method: 'PATCH', body: input })

export const changePassword = (input: PasswordChangeInput) =>
  apiRequest<MeResponse>('/v1/auth/password', { method: 'POST', body: input })

export const requestPasswordReset = (input: PasswordResetRequestInput) =>
  apiRequest<{ message: string }>('/v1/auth/password-reset', { method: 'POST', body: input })

/** Mails a new confirmation link to the signed-in account's address. */
export const resendEmailVerification = () =>
  apiRequest<{ message: string }>('/v1/auth/email-verification', { method: 'POST' })

export const confirmEmailVerification = (input: EmailVerificationConfirmInput) =>
  apiRequest<void>('/v1/auth/email-verification/confirm', { method: 'POST', body: input })

export const confirmPasswordReset = (input: PasswordResetConfirmInput) =>
  apiRequest<void>('/v1/auth/password-reset/confirm', { method: 'POST', body: input })
