import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'

/** Every API route file under server/api as `METHOD /api/path/:param` (the matrix and fuzz tables' keys). */
export function routesOnDisk(): string[] {
  const root = join(process.cwd(), 'server/api')
  const out: string[] = []
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const full = join(dir, name)
      if (statSync(full).isDirectory()) walk(full)
      else if (/\.(get|post|patch|put|delete)\.ts$/.test(name)) {
        const [, path, method] = /^(.*)\.(get|post|patch|put|delete)\.ts$/.exec(relative(root, full))!
        const url = `/api/${path!.replace(/(^|\/)index$/, '').replace(/\[(\w+)\]/g, ':$1')}`.replace(/\/$/, '')
        out.push(`${method!.toUpperCase()} ${url}`)
      }
    }
  }
  walk(root)
  return out.sort()
}
