import type { Knex } from 'knex'
import type { PresetProcess } from '#shared/schemas/library'
import type { PresetDto, TemplateDto } from '#shared/types/library'

/** Roles that may write the team library (process presets and spec templates). */
export const LIBRARY_WRITER_ROLES = ['admin', 'architect'] as const

/** camelCase process field ↔ snake_case column of process_presets. */
const COLUMN: Record<keyof PresetProcess, string> = {
  sheetOhmPerSq: 'sheet_ohm_per_sq', matchingPctUm: 'matching_pct_um', matchingConvention: 'matching_convention',
  unitOhm: 'unit_ohm', switchOhm: 'switch_ohm', switchSkewS: 'switch_skew_s', switchChargeC: 'switch_charge_c',
  switchAreaUm2: 'switch_area_um2', gateAreaUm2: 'gate_area_um2', layoutOverhead: 'layout_overhead',
  minWidthUm: 'min_width_um', minLengthUm: 'min_length_um'
}
const KEYS = Object.keys(COLUMN) as (keyof PresetProcess)[]

type Row = Record<string, unknown> & { id: number, name: string, description: string | null, is_demo: number | boolean, version: number, created_at: Date, updated_at: Date }

/** Process fields → column values (an "auto" unit resistor is NULL). */
export function presetColumns(process: PresetProcess): Record<string, unknown> {
  return Object.fromEntries(KEYS.map(k => [COLUMN[k], k === 'unitOhm' && process.unitOhm === 'auto' ? null : process[k]]))
}

function common(row: Row) {
  return {
    id: row.id, name: row.name, description: row.description, isDemo: Boolean(row.is_demo), version: row.version,
    createdAt: row.created_at.toISOString(), updatedAt: row.updated_at.toISOString()
  }
}

export function toPresetDto(row: Row): PresetDto {
  const process = Object.fromEntries(KEYS.map(k => [k, row[COLUMN[k]] ?? (k === 'unitOhm' ? 'auto' : null)])) as PresetProcess
  return { ...common(row), process }
}

export function toTemplateDto(row: Row): TemplateDto {
  const spec = typeof row.spec === 'string' ? JSON.parse(row.spec) : row.spec
  return { ...common(row), spec }
}

/** A 409 whose message a person can act on; `data.currentVersion` lets the client reload. */
export function conflict(message: string, currentVersion?: number) {
  return createError({ statusCode: 409, statusMessage: 'Conflict', message, data: { message, currentVersion } })
}

export function notFound() {
  return createError({ statusCode: 404, statusMessage: MESSAGES.notFound })
}

/** True for MariaDB's duplicate-key error (a unique name already taken). */
export function isDuplicateKey(error: unknown): boolean {
  return typeof error === 'object' && error !== null && (error as { code?: string }).code === 'ER_DUP_ENTRY'
}

/**
 * Updates one team row only if its version is still `version`, bumping it; 404 when the row is
 * not the team's, 409 (with the current version) when someone else saved first.
 */
export async function updateVersioned(trx: Knex.Transaction, table: string, teamId: number, id: number, version: number, values: Record<string, unknown>): Promise<void> {
  const current = await trx(table).where({ id, team_id: teamId }).forUpdate().first('version')
  if (!current) throw notFound()
  if (current.version !== version) {
    throw conflict(`version: this item was changed by someone else (you edited version ${version}, the current one is ${current.version}); reload it and apply your changes again`, current.version)
  }
  await trx(table).where({ id }).update({ ...values, version: version + 1, updated_at: trx.fn.now() })
}

/** Runs a library write, turning a taken name into a 409 naming the field. */
export async function withUniqueName<T>(kind: string, name: string | undefined, work: () => Promise<T>): Promise<T> {
  try {
    return await work()
  } catch (error) {
    if (isDuplicateKey(error)) throw conflict(`name: your team already has a ${kind} named “${name ?? ''}”; choose another name`)
    throw error
  }
}
