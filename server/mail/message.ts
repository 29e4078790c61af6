export interface MailMessage {
  to: string
  subject: string
  text: string
  html: string
  /**
   * In the built-in mail catcher only: the teams whose admins may read this message there. A
   * reset link must not be readable by whoever made an account (every account admins its own team).
   */
  shownToAdminsOf: number[]
}
