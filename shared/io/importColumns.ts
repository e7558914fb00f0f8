/**
 * The columns a spec CSV may have after `title` and `blockName`: each engine field, by its contract
 * name, with its catalogue entry when the form has one. Kept apart from specImport.ts so the
 * browser can list them without loading the CSV reader.
 */
import { evaluateOptionsSchema, evaluateProcessSchema, evaluateSpecSchema } from '../core/contract/evaluate'
import { FIELDS, type FieldDef, type FieldSection } from '../schemas/fields'

export const IMPORT_SCHEMAS = { spec: evaluateSpecSchema, process: evaluateProcessSchema, options: evaluateOptionsSchema } as const
const SECTIONS: FieldSection[] = ['spec', 'process', 'options']

export interface ImportColumn { name: string, section: FieldSection, key: string, def: FieldDef | null }

/** Every column a CSV may have after `title` and `blockName`: each engine field, by its contract name. */
export const IMPORT_COLUMNS: ImportColumn[] = SECTIONS.flatMap(section => Object.keys(IMPORT_SCHEMAS[section].shape).map(key => ({
  name: key, section, key, def: FIELDS.find(f => f.section === section && f.key === key) ?? null
})))
