/**
 * Gives the bundled worker a `require` for the CommonJS packages it carries (json-rules-engine →
 * jsonpath-plus loads `vm`): esbuild's ESM output calls a global `require` when one exists and
 * throws "Dynamic require … is not supported" otherwise. Imported first by the worker entry.
 */
import { createRequire } from 'node:module'

const scope = globalThis as { require?: NodeJS.Require }
scope.require ??= createRequire(import.meta.url)
