// A cache keyed by a sequence of strings, found by walking one Map per step: for keys made once (ion ids, form keys,
// fit formulas), each step looks up a string whose hash is already known, and nothing is built for a sequence seen
// before, where joining the keys into one string would build and hash a new one on every call.

interface Node<T> { next: Map<string, Node<T>>; value?: T }

/**
 * A sequence-keyed cache that starts again when it holds `limit` values.
 * @example const t = new KeyTrie<number>(100); t.at(['Na+', 'Cl-']).value ??= 1;
 */
export class KeyTrie<T> {
  private root: Node<T> = { next: new Map() };
  private count = 0;

  constructor(private readonly limit: number) {}

  /** The start of a walk: pass the result to `step` once per key, then read or set `.value` with `set`. */
  start(): Node<T> {
    return this.root;
  }

  step(node: Node<T>, key: string): Node<T> {
    let child = node.next.get(key);
    if (!child) { child = { next: new Map() }; node.next.set(key, child); }
    return child;
  }

  /** The node of a whole sequence. */
  at(keys: readonly string[]): Node<T> {
    let node = this.root;
    for (const key of keys) node = this.step(node, key);
    return node;
  }

  /** Stores a value at a node reached by `step` or `at`; the whole cache starts again past its limit. */
  set(node: Node<T>, value: T): T {
    if (++this.count > this.limit) { this.root = { next: new Map() }; this.count = 0; }
    node.value = value;
    return value;
  }
}
