import type { Role } from './auth'

export interface TeamMemberDto { id: number, name: string, email: string, role: Role, active: boolean }
export interface PendingInvitationDto { id: number, name: string, email: string, role: Role, expiresAt: string, invitedBy: string | null }
export interface TeamDto { members: TeamMemberDto[], invitations: PendingInvitationDto[] }
export interface InvitationPreviewDto { email: string, name: string, role: Role, teamName: string, expiresAt: string }
export interface CaughtMailDto { id: string, messageId: string, receivedAt: string, from: string, to: string[], subject: string, text: string, html: string }
