/**
 * The shapes a calc document passes through:
 * markdown → Block[] → Cell[] → CellGraph → CellState per cell → sheet HTML.
 */
import type { MathNode } from 'mathjs';
import type { Diagnostic } from './diagnostic.js';

/** 1-based line and column, 0-based offset into the normalised source. */
export interface Position {
  line: number;
  column: number;
  offset: number;
}

export interface Span {
  start: Position;
  end: Position;
}

/** The fence info strings that make a code block a live cell. */
export const CELL_KINDS = ['given', 'calc', 'check', 'figure', 'cases'] as const;
export type CellKind = (typeof CELL_KINDS)[number];

/** Markdown between cells: rendered as ordinary prose. */
export interface ProseBlock {
  kind: 'prose';
  raw: string;
  span: Span;
}

/** A fenced block whose info string is a cell kind. */
export interface CalcBlock {
  kind: 'calc';
  cellKind: CellKind;
  raw: string;
  /** The text between the fences. */
  body: string;
  /** Where the body's first character sits in the document. */
  bodyStart: Position;
  span: Span;
}

export type Block = ProseBlock | CalcBlock;

/** The title block and anything else in the front matter. */
export type Meta = Record<string, unknown>;

/** An allowed range from a `given` comment: `[3 m, 12 m]`. */
export interface ValueRange {
  lo: string;
  hi: string;
  loNode: MathNode;
  hiNode: MathNode;
}

/** One statement of a cell: a definition, a check or a figure. */
export interface Cell {
  /** Unique id: the defined name, or `check@L30` / `figure@L12` for unnamed lines. */
  id: string;
  /** The defined name, null for an unnamed check or figure. */
  name: string | null;
  kind: CellKind;
  /** The statement as written, without its comment (multi-line statements keep their newlines). */
  text: string;
  /** The expression after `name =`, as written. */
  source: string;
  /** Parsed expression (the right-hand side). */
  node: MathNode;
  /** Text after `#`, without the range. */
  description: string;
  range: ValueRange | null;
  /** Display unit from a top-level `to UNIT`, e.g. 'kN/m'. */
  displayUnit: string | null;
  /** Names this cell reads that other cells define. */
  uses: string[];
  /** Functions and constants it calls from the library. */
  calls: string[];
  span: Span;
  /** Index of the CalcBlock holding it. */
  block: number;
  /** True when `--set` or an edit replaced the document's value. */
  overridden: boolean;
  /** The document's own expression when overridden. */
  originalSource: string | null;
}

export interface CellGraph {
  cells: Cell[];
  byId: Map<string, Cell>;
  /** Cell ids in an order where every cell comes after what it uses (cycles left out). */
  order: string[];
  /** Ids of cells that failed before evaluation (parse, unknown name, cycle…). */
  failed: Map<string, Diagnostic>;
  /** Statements that never became cells because they could not be read. */
  unparsed: Array<{ id: string; name: string | null; kind: CellKind; diagnostic: Diagnostic }>;
}

/** The result of one line of a check cell. Checks are values, not errors. */
export interface CheckResult {
  isCheck: true;
  source: string;
  op: '<=' | '>=' | '<' | '>' | null;
  demand: unknown;
  capacity: unknown;
  /** ≤ 1 passes; null where no ratio applies. */
  utilization: number | null;
  pass: boolean;
}

export type CellState =
  | { status: 'pending' }
  | { status: 'ok'; value: unknown }
  | { status: 'error'; diagnostic: Diagnostic }
  /** `note`, when set, says why in full ("not computed: a.H_min is not available — …"). */
  | { status: 'blocked'; by: string; note?: string };

/** One line of a ```cases cell (read by engine/cases): a case, or a family when a value is a list. */
export interface CaseLine {
  name: string;
  /** Input name → its value expression as written, parsed; `column` is where the input's name stands. */
  values: Array<{ input: string; source: string; node: MathNode; column: number }>;
  description: string;
  span: Span;
}

/** The document's cases, and the checks limited to some of them (check id → case or family names). */
export interface CaseBook {
  lines: CaseLine[];
  limits: Map<string, string[]>;
}

/** Everything `compile` learns before evaluation. */
export interface CompiledDocument {
  file: string;
  source: string;
  meta: Meta;
  blocks: Block[];
  graph: CellGraph;
  diagnostics: Diagnostic[];
  /** The ```cases cells; empty when the document has none. */
  cases: CaseBook;
}
