import { z } from 'zod'
import { singleLineMessage, singleLinePattern } from './single-line'

// Request bodies of /api/v1/auth, used by the forms (client) and the routes (server) alike.

/** Addresses are compared trimmed and lower-cased; 254 is the longest usable address (RFC 5321). */
export const emailSchema = z
  .string({ message: 'Enter an e-mail address' })
  .trim()
  .toLowerCase()
  .max(254, 'An e-mail address has at most 254 characters')
  .pipe(z.email({ message: 'Enter an e-mail address such as name@example.com' }))

// Length counted in characters, not UTF-16 units; no composition rules (NIST SP 800-63B §3.1.1.2).
export const passwordMinLength = 12
export const passwordMaxLength = 128
const characterCount = (value: string): number => [...value].length

/** A new password. The server also refuses common and guessable ones (zxcvbn). */
export const newPasswordSchema = z
  .string({ message: 'Enter a password' })
  .refine((value) => characterCount(value) >= passwordMinLength, {
    message: `Use at least ${passwordMinLength} characters`,
  })
  .refine((value) => characterCount(value) <= passwordMaxLength, {
    message: `Use at most ${passwordMaxLength} characters`,
  })

/** A password being checked: no length floor, so accounts made under older rules can sign in. */
const givenPasswordSchema = z
  .string({ message: 'Enter your password' })
  .min(1, 'Enter your password')
  .refine((value) => characterCount(value) <= passwordMaxLength, {
    message: `A password has at most ${passwordMaxLength} characters`,
  })

export const personNameSchema = z
  .string({ message: 'Enter a name' })
  .trim()
  .min(1, 'Enter a name')
  .max(80, 'Use at most 80 characters')
  .regex(singleLinePattern, singleLineMessage)

export const signUpSchema = z.object({
  email: emailSchema,
  password: newPasswordSchema,
  name: personNameSchema,
})

export const signInSchema = z.object({
  email: emailSchema,
  password: givenPasswordSchema,
})

export const profileUpdateSchema = z.object({ name: personNameSchema })

export const passwordChangeSchema = z.object({
  currentPassword: givenPasswordSchema,
  newPassword: newPasswordSchema,
})

export const passwordResetRequestSchema = z.object({ email: emailSchema })

/** Tokens in e-mailed links: 32 random bytes in base64url (43 characters). */
export const linkTokenSchema = z
  .string({ message: 'The link has no token' })
  .regex(/^[A-Za-z0-9_-]{43}$/, 'The link is incomplete: open it again from the e-mail')

export const passwordResetConfirmSchema = z.object({
  token: linkTokenSchema,
  password: newPasswordSchema,
})

export const emailVerificationConfirmSchema = z.object({ token: linkTokenSchema })

export type SignUpInput = z.infer<typeof signUpSchema>
export type SignInInput = z.infer<typeof signInSchema>
export type ProfileUpdateInput = z.infer<typeof profileUpdateSchema>
export type PasswordChangeInput = z.infer<typeof passwordChangeSchema>
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestSchema>
export type EmailVerificationConfirmInput = z.infer<typeof emailVerificationConfirmSchema>
export type PasswordResetConfirmInput = z.infer<typeof passwordResetConfirmSchema>
