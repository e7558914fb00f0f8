/** The four roles of a Rungwise team, from most to least privileged in practice. */
export const ROLES = ['admin', 'architect', 'engineer', 'manager'] as const
export type Role = typeof ROLES[number]

/** Roles that may create and edit studies (a manager reads and comments, never edits numbers). */
export const STUDY_EDITOR_ROLES: readonly Role[] = ['admin', 'architect', 'engineer']

/** The signed-in user as every protected route and page sees it. */
export interface SessionUser {
  id: number
  email: string
  name: string
  role: Role
  teamId: number
  teamName: string
}
