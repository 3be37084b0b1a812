// Line and column of a path (['sweep', 'over', 'Re', 'count']) in a parsed YAML
// document, so every diagnostic points at the key or value it is about.
import { isAlias, isMap, isPair, isScalar, isSeq, type Document, type LineCounter, type Node } from 'yaml';

export type Path = readonly (string | number)[];

export interface Position {
  line: number;
  column: number;
}

export class PositionFinder {
  constructor(
    private readonly doc: Document,
    private readonly lines: LineCounter,
  ) {}

  /** Position of an offset into the text. */
  at(offset: number): Position {
    const { line, col } = this.lines.linePos(offset);
    return { line, column: col };
  }

  /**
   * Where the value at `path` is; with `key: true`, where its key is. A path that does
   * not exist (a missing key) resolves to the deepest existing ancestor's key, and an
   * empty document to line 1, column 1.
   */
  find(path: Path, options: { key?: boolean } = {}): Position {
    let node: Node | null = this.doc.contents as Node | null;
    let keyNode: Node | null = null;
    for (const segment of path) {
      const next = this.child(this.resolve(node), segment);
      if (!next) break;
      node = next.value;
      keyNode = next.key;
      if (!node) break;
    }
    const target = options.key || !node ? (keyNode ?? node) : node;
    const start = target?.range?.[0];
    return start === undefined ? { line: 1, column: 1 } : this.at(start);
  }

  private child(node: Node | null, segment: string | number): { key: Node | null; value: Node | null } | undefined {
    if (isMap(node)) {
      for (const pair of node.items) {
        if (!isPair(pair)) continue;
        const key = pair.key as Node | null;
        const name = isScalar(key) ? key.value : key;
        if (String(name) === String(segment)) return { key, value: pair.value as Node | null };
      }
      return undefined;
    }
    if (isSeq(node) && typeof segment === 'number') {
      const item = node.items[segment] as Node | undefined;
      return item === undefined ? undefined : { key: item, value: item };
    }
    return undefined;
  }

  // Paths run through aliases into the anchored node; the position stays at the alias.
  private resolve(node: Node | null): Node | null {
    if (isAlias(node)) return (node.resolve(this.doc) as Node | undefined) ?? node;
    return node;
  }
}
