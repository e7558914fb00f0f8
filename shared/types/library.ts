import type { EvaluateSpec } from '../core/contract/evaluate'
import type { PresetProcess } from '../schemas/library'

/** A process preset as the API returns it (demo presets are invented data and say so). */
export interface PresetDto {
  id: number
  name: string
  description: string | null
  process: PresetProcess
  isDemo: boolean
  version: number
  createdAt: string
  updatedAt: string
}

/** A spec template: a named spec the team starts studies from. */
export interface TemplateDto {
  id: number
  name: string
  description: string | null
  spec: EvaluateSpec
  isDemo: boolean
  version: number
  createdAt: string
  updatedAt: string
}
