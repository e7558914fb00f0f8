import type { TeamDto } from '#shared/types/team'

export interface MentionMember { id: number, name: string, role: string, handle: string }

/**
 * Team members as the composer suggests them: the handle is the part of the address before the @
 * when no other member shares it, else the whole address (the server resolves both the same way).
 */
export function useMentionMembers() {
  const { data } = useFetch<TeamDto>('/api/team', { key: 'notes:team', default: () => ({ members: [], invitations: [] }), server: false })
  return computed<MentionMember[]>(() => {
    const members = data.value.members.filter(m => m.active)
    const local = (email: string) => email.toLowerCase().split('@')[0]!
    return members.map(m => ({
      id: m.id, name: m.name, role: m.role,
      handle: members.filter(o => local(o.email) === local(m.email)).length === 1 ? local(m.email) : m.email.toLowerCase()
    }))
  })
}
