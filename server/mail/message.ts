export interface MailMessage {
  to: string
  subject: string
  text: string
  html: string
  /**
   * The team that sent it (an invitation, a card): that team's admins may read it in the built-in
   * mail catcher. Null for mail that grants access to an account (a reset or confirmation link):
   * only its addressee may read that, or anyone who signed up could take the accounts of the people
   * they invite.
   */
  sentByTeamId: number | null
}
