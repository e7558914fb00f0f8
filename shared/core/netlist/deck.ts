/**
 * A small SPICE deck writer: unique element names (SPICE names are case-insensitive), no
 * element without a value, every element with a comment line naming what it is.
 */

export interface Deck {
  /** a `*` comment line */
  comment: (text: string) => void
  /** an element line `NAME n1 n2 … value`, preceded by `* comment` when given */
  element: (name: string, nodes: string[], value: string, comment?: string) => void
  /** a raw line (control block, directives) */
  raw: (line: string) => void
  /** the finished text, newline-terminated */
  text: () => string
  /** number of elements written */
  count: () => number
}

/** Formats a number so SPICE reads it back exactly (shortest round-trip decimal). */
export function num(x: number): string {
  if (!Number.isFinite(x)) throw new Error(`cannot write a non-finite value (${x}) into a netlist`)
  return String(x)
}

/** Creates an empty deck. */
export function createDeck(): Deck {
  const lines: string[] = []
  const names = new Set<string>()
  return {
    // a comment must stay one line: a line break would let the text become a SPICE command
    comment: text => lines.push(`* ${text.replace(/\p{Cc}/gu, ' ')}`),
    element: (name, nodes, value, comment) => {
      const key = name.toLowerCase()
      if (names.has(key)) throw new Error(`duplicate element name ${name}`)
      if (value.trim() === '') throw new Error(`element ${name} has no value`)
      names.add(key)
      if (comment) lines.push(`* ${comment.replace(/\p{Cc}/gu, ' ')}`)
      lines.push(`${name} ${nodes.join(' ')} ${value}`)
    },
    raw: line => lines.push(line),
    text: () => `${lines.join('\n')}\n`,
    count: () => names.size
  }
}

/**
 * Ideal single-pole double-throw switch as controlled sources: node `out` copies `lo` when
 * V(bit) = 0 and `hi` when V(bit) = 1 (a voltage source), and the current leaving `out`
 * (measured by a 0 V ammeter) is drawn from the selected terminal (current sources), so the
 * pair behaves as a wire to the selected terminal. Ground terminals need no current source.
 * Elements: B<id>V, V<id>A, B<id>H, B<id>L.
 */
export function selector(deck: Deck, id: string, out: string, lo: string, hi: string, bit: string, what: string): void {
  const v = (node: string) => (node === '0' ? '0' : `V(${node})`)
  const sel = `V(${bit})`
  const expr = lo === '0' ? `${sel}*${v(hi)}` : `${v(lo)}+${sel}*(${v(hi)}-${v(lo)})`
  const inner = `${out}_x`
  deck.element(`B${id}V`, [inner, '0'], `V=${expr}`, `${what}: ideal switch, selects ${hi} when ${bit} = 1, else ${lo}`)
  deck.element(`V${id}A`, [inner, out], 'DC 0', `${what}: 0 V ammeter of the switch current`)
  if (hi !== '0') deck.element(`B${id}H`, [hi, '0'], `I=${sel}*I(V${id}A)`, `${what}: switch current drawn from ${hi}`)
  if (lo !== '0') deck.element(`B${id}L`, [lo, '0'], `I=(1-${sel})*I(V${id}A)`, `${what}: switch current drawn from ${lo}`)
}

/** Bit decoder: node b<i> (i = 1 … n, b1 = MSB) is 1 V when bit i of round(V(code)) is set. */
export function bitDecoders(deck: Deck, n: number): void {
  for (let i = 1; i <= n; i++) {
    const p = n - i
    const expr = `floor((V(code)+0.5)/${2 ** p})-2*floor((V(code)+0.5)/${2 ** (p + 1)})`
    deck.element(`BBIT${i}`, [`b${i}`, '0'], `V=${expr}`, `bit ${i} of the code (weight 2^${p}), 0 or 1 V`)
  }
}

/**
 * Binary tree of selectors choosing one of `leaves` (2^levels nodes) by the bits `bitNodes`
 * (LSB level first); the root node is `root`. Each tree node is one selector named `<prefix><level>_<j>`.
 */
export function selectorTree(deck: Deck, prefix: string, leaves: string[], bitNodes: string[], root: string, what: string): void {
  let level = leaves
  bitNodes.forEach((bit, l) => {
    const next: string[] = []
    for (let j = 0; j < level.length / 2; j++) {
      const node = l === bitNodes.length - 1 ? root : `${prefix.toLowerCase()}${l + 1}_${j}`
      selector(deck, `${prefix}${l + 1}_${j}`, node, level[2 * j] as string, level[2 * j + 1] as string, bit, `${what} level ${l + 1} node ${j}`)
      next.push(node)
    }
    level = next
  })
}
