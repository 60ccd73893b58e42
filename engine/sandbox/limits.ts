/**
 * The limits a document is evaluated within. README "Security model" states them;
 * change both together.
 */
export const LIMITS = {
  /** Characters in a whole document; a longer one is refused before it is parsed. */
  documentChars: 1_000_000,
  /** Statements (cells) in a whole document; the ones past it are not evaluated. */
  cells: 1_000,
  /** Bracket nesting inside one statement: mathjs's parser recurses once per level. */
  bracketDepth: 100,
  /** Depth of an expression's tree (a chain `a * b * c …` is one level per factor). */
  treeDepth: 500,
  /** Nodes in one expression's tree. */
  treeNodes: 5_000,
  /** Elements in any one list or matrix a function builds or a cell gives. */
  elements: 100_000,
  /** Characters in any one text a function builds or a cell gives (figures are SVG text). */
  textChars: 5_000_000,
  /** Pairwise work (n × m comparisons or products) of one call. */
  work: 20_000_000,
  /** Significant figures / digits a format call may ask for. */
  digits: 64,
  /** Loop count of the combinatorics functions (n in combinations(n, k) …). */
  count: 100_000,
  /** Wall-clock time one cell may take, checked at every guarded call and at its end (ms). */
  cellMs: 2_000,
  /** Wall-clock time all the cells of one evaluation round may take (ms). */
  documentMs: 10_000,
} as const;
