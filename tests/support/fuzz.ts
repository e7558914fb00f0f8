import fc from 'fast-check'

/**
 * Adversarial values for fuzzing JSON bodies, query strings and path parameters. A `Raw` is written
 * into the JSON text as it is (`-0`, `1e400`, `NaN`), which JSON.stringify cannot produce.
 */
export class Raw {
  constructor(readonly text: string) {}
}

const MB = 1024 * 1024

/** Strings people and attackers send: empty, huge, control characters, lone surrogates, RTL, markup. */
export const nastyString = fc.oneof(
  fc.constantFrom('', ' ', 'NaN', 'Infinity', '-Infinity', '-0', '1e400', '0x10', '1_000', 'null', 'true', '[]', '{}',
    '\u0000', '\uD800', '\uDFFF', 'a\uD800b', '\u202Eevil\u202C', '\u05E9\u05DC\u05D5\u05DD', '\uFEFF1', '１２', '٣',
    '<script>alert(1)</script>', '"; DROP TABLE studies; --', '../../etc/passwd', '%00', '__proto__', 'constructor',
    '😀'.repeat(100), 'x'.repeat(300), 'é'.repeat(5000)),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.constant('a'.repeat(MB))
)

/** Numbers at and beyond every boundary, and the non-finite ones as JSON cannot carry them. */
export const nastyNumber = fc.oneof(
  fc.constantFrom(0, 1, -1, 0.5, 2 ** 31, 2 ** 31 - 1, -(2 ** 31), 2 ** 53 + 1, Number.MAX_VALUE, Number.MIN_VALUE, -Number.MAX_VALUE, 1e308, 5e-324),
  fc.double(),
  fc.integer(),
  fc.constantFrom(new Raw('-0'), new Raw('1e400'), new Raw('-1e400'), new Raw('NaN'), new Raw('Infinity'), new Raw('1' + '0'.repeat(400)))
)

/** Deeply nested arrays or objects, as JSON text (too deep for a recursive serializer). */
function nested(depth: number, asArray: boolean): Raw {
  return new Raw(asArray ? `${'['.repeat(depth)}1${']'.repeat(depth)}` : `${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`)
}

/** Any JSON-ish value, including the shapes that break naive code. */
export const nastyValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: nastyString },
  { weight: 3, arbitrary: nastyNumber },
  { weight: 1, arbitrary: fc.constantFrom(null, true, false, [], {}, [null], [[]], { '': null }) },
  { weight: 1, arbitrary: fc.integer({ min: 1, max: 5000 }).map(d => nested(d, d % 2 === 0)) },
  { weight: 1, arbitrary: fc.array(nastyNumber, { maxLength: 5 }) },
  { weight: 1, arbitrary: fc.constant(Array.from({ length: 70_000 }, () => 1)) },
  { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 3 }) }
)

/** Sets an own, enumerable key (so `__proto__` becomes a key in the JSON text, not a prototype). */
function setOwn(target: Record<string, unknown>, key: string, value: unknown) {
  Object.defineProperty(target, key, { value, enumerable: true, writable: true, configurable: true })
}

/** JSON text for a value tree that may hold Raw tokens and own `__proto__` keys. */
export function toJsonText(value: unknown): string {
  if (value instanceof Raw) return value.text
  if (Array.isArray(value)) return `[${value.map(toJsonText).join(',')}]`
  if (value !== null && typeof value === 'object') {
    return `{${Object.keys(value).map(k => `${JSON.stringify(k)}:${toJsonText((value as Record<string, unknown>)[k])}`).join(',')}}`
  }
  return JSON.stringify(value) ?? 'null'
}

type Path = (string | number)[]

/** Every path into a sample (objects and arrays and their leaves), root first. */
function paths(value: unknown, prefix: Path = []): Path[] {
  const out: Path[] = [prefix]
  if (Array.isArray(value)) value.forEach((v, i) => out.push(...paths(v, [...prefix, i])))
  else if (value !== null && typeof value === 'object') for (const [k, v] of Object.entries(value)) out.push(...paths(v, [...prefix, k]))
  return out
}

function clone(value: unknown): unknown {
  return value === undefined ? undefined : JSON.parse(JSON.stringify(value))
}

function at(root: unknown, path: Path): unknown {
  return path.reduce<unknown>((v, k) => (v as Record<string | number, unknown>)?.[k], root)
}

export type Mutation = { kind: 'replace' | 'remove' | 'extra' | 'root' | 'raw', path: Path, key?: string, value?: unknown, text?: string }

const extraKey = fc.constantFrom('__proto__', 'constructor', 'prototype', 'isAdmin', 'teamId', 'team_id', 'version', 'id', '', ' ', '\uD800', 'role')

/** Mutations of one valid sample: a field replaced or removed, an extra (polluting) key, or a wholly different body. */
export function mutationOf(sample: unknown): fc.Arbitrary<Mutation> {
  const all = paths(sample)
  const isObject = (v: unknown) => v !== null && typeof v === 'object' && !Array.isArray(v)
  const objects = all.filter(p => isObject(at(sample, p)))
  const inner = all.filter(p => p.length > 0)
  const options: fc.Arbitrary<Mutation>[] = [
    fc.record({ kind: fc.constant('root' as const), path: fc.constant([]), value: nastyValue }),
    fc.constantFrom('', '{', '{"a":', '[1,]', '{"a":1}{"b":2}', 'null', '"\\ud800"', '\u0000', '{"__proto__":{"polluted":1}}', '{"constructor":{"prototype":{"polluted":1}}}')
      .map(text => ({ kind: 'raw' as const, path: [], text }))
  ]
  if (inner.length > 0) {
    options.push(fc.record({ kind: fc.constant('replace' as const), path: fc.constantFrom(...inner), value: nastyValue }))
    options.push(fc.record({ kind: fc.constant('remove' as const), path: fc.constantFrom(...inner) }))
  }
  if (objects.length > 0) options.push(fc.record({ kind: fc.constant('extra' as const), path: fc.constantFrom(...objects), key: extraKey, value: nastyValue }))
  return fc.oneof(...options)
}

/** The JSON text of `sample` after `m`. */
export function applyMutation(sample: unknown, m: Mutation): string {
  if (m.kind === 'raw') return m.text!
  if (m.kind === 'root') return toJsonText(m.value)
  const copy = clone(sample) as Record<string | number, unknown>
  const parent = at(copy, m.path.slice(0, -1)) as Record<string | number, unknown>
  const last = m.path[m.path.length - 1]!
  if (m.kind === 'replace') parent[last] = m.value
  else if (m.kind === 'remove') {
    if (Array.isArray(parent)) parent.splice(Number(last), 1)
    else Reflect.deleteProperty(parent, last)
  } else setOwn(at(copy, m.path) as Record<string, unknown>, m.key!, m.value)
  return toJsonText(copy)
}

/** Query strings: each value replaced by a nasty string, repeated (arrays) or extra keys added. */
export function queryMutationOf(sample: Record<string, string>): fc.Arbitrary<string> {
  const keys = Object.keys(sample)
  const value = fc.oneof(nastyString.filter(s => s.length < 10_000), nastyNumber.map(n => (n instanceof Raw ? n.text : String(n))))
  const key = keys.length > 0 ? fc.oneof(fc.constantFrom(...keys), extraKey) : extraKey
  return fc.array(fc.tuple(key, value, fc.boolean()), { minLength: 1, maxLength: 4 }).map((changes) => {
    const params = new URLSearchParams(sample)
    for (const [k, v, repeat] of changes) {
      if (repeat) params.append(k, v)
      else params.set(k, v)
    }
    return params.toString()
  })
}

/** Path parameter values: out of range, signed, fractional, encoded, unicode. */
export const nastyParam = fc.oneof(
  fc.constantFrom('0', '-1', '-0', '1.5', '1e3', '0x1', '2147483648', '9'.repeat(400), 'NaN', 'Infinity', ' 1', '1 ', '%00', '%2e%2e', '..', '١', '\uD800', 'a'.repeat(5000), 'null', '[]'),
  fc.string({ maxLength: 30 }).filter(s => s.length > 0)
)

/** A URL path segment for a parameter value (encoded so it stays one segment). */
export function encodeParam(value: string): string {
  return encodeURIComponent(value.replace(/[\uD800-\uDFFF]/g, '\uFFFD'))
}
