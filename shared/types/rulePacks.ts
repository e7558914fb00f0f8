import type { Finding } from '../findings/runner'
import type { RulePackDocument } from '../findings/schema'

/** A team rule pack as the API returns it. */
export interface RulePackDto {
  id: number
  packId: string
  name: string
  enabled: boolean
  version: number
  pack: RulePackDocument
  ruleCount: number
  createdAt: string
  updatedAt: string
}

/** A read-only built-in pack in the list. */
export interface BuiltInPackDto {
  packId: string
  name: string
  description: string
  version: number
  pack: RulePackDocument
  ruleCount: number
}

export interface RulePackListDto {
  builtIn: BuiltInPackDto[]
  team: RulePackDto[]
}

/** One saved version of a pack. */
export interface RulePackVersionDto {
  version: number
  enabled: boolean
  change: string
  authorName: string | null
  createdAt: string
  pack: RulePackDocument
}

/** A dry run: which of the pack's rules fire on which candidates of the sample. */
export interface RulePackDryRunDto {
  packId: string
  sample: 'sample' | 'input' | 'evaluation'
  candidateCount: number
  findings: Finding[]
  /** rule id → candidate ids it fired on (every rule of the pack listed, [] when silent) */
  fired: Record<string, string[]>
}
