/**
 * The one mathjs instance every cell is evaluated with.
 *
 * It adds the engineering units mathjs lacks and then disables the functions
 * that would let a document reach outside plain expressions, following the
 * "security" page of the mathjs documentation: a document is data, not code.
 */
import { create, all, type MathJsInstance, type MathNode, type Unit } from 'mathjs';

const instance: MathJsInstance = create(all, { number: 'number', precision: 14, matrix: 'Array' });

// US customary units used on vault and wall calcs that mathjs lacks (it has
// kip, lbf, psi, ft already). Factors from NIST SP 811, Appendix B.
instance.createUnit({
  ksi: '6894757.2931783 Pa',
  psf: '47.880258980336 Pa',
  pcf: '157.08746384624 N/m^3',
  plf: '14.593902937206 N/m',
  klf: '14593.902937206 N/m',
  kipft: '1355.8179483314 N m',
  ksf: '47880.258980336 Pa',
  kcf: '157087.46384624 N/m^3',
});
// mathjs's kip is 4448.2216 N, 3.4e-9 short of 1000 lbf (so 1 kip − 1000 lbf was −3.4e-6 lbf), and its psi
// 6e-11 off lbf/in²: both redefined from its exact lbf (4.4482216152605 N) and inch (0.0254 m).
instance.createUnit('kip', { definition: '1000 lbf', aliases: ['kips'] }, { override: true });
instance.createUnit('psi', { definition: '1 lbf/in^2' }, { override: true });

// atan2 of two quantities of the same dimension (H_y, H_x) is an angle, as in statics.
instance.import({
  atan2: instance.typed('atan2', {
    'Unit, Unit': (y: Unit, x: Unit) => {
      if (!y.equalBase(x)) throw new TypeError(`atan2 needs two values of the same kind, got ${y.formatUnits()} and ${x.formatUnits()}`);
      const angle = instance.unit(Math.atan2(y.toSI().toNumber(), x.toSI().toNumber()), 'rad');
      // A computed angle, not one written in rad: shown in degrees like every other angle.
      return Object.assign(angle, { skipAutomaticSimplification: false });
    },
  }),
});

/** mathjs's import, captured before it is disabled: the engine registers cell functions with it. */
export const registerFunctions: (table: Record<string, unknown>) => void = (table) => {
  instanceImport(table, { override: true });
};
const instanceImport = instance.import.bind(instance);

/** mathjs's parser, captured before the document-facing copy is disabled. */
export const parseExpression: (expr: string) => MathNode = instance.parse.bind(instance);

/** Names a document may never call; each throws a clear error when used. */
export const DISABLED_FUNCTIONS = [
  'import', 'createUnit', 'evaluate', 'parse', 'compile', 'simplify', 'simplifyConstant',
  'simplifyCore', 'derivative', 'resolve', 'reviver', 'replacer', 'rationalize',
  'symbolicEqual', 'leafCount', 'parser', 'help',
] as const;

/**
 * Names refused before evaluation rather than overridden: replacing them in
 * the instance would break mathjs's own lazy factories.
 */
export const WITHHELD_NAMES = ['config', 'typed', 'chain', 'on', 'off', 'once', 'emit', 'expression'] as const;

const disabled: Record<string, () => never> = {};
for (const name of DISABLED_FUNCTIONS) {
  disabled[name] = () => {
    throw new SandboxError(`the function ${name} is not available in a calc document`);
  };
}

/** Raised when a document reaches for something the sandbox withholds. */
export class SandboxError extends Error {
  override name = 'SandboxError';
}

instance.import(disabled, { override: true });

// The configuration every mathjs function reads (tolerances, number type) is fixed once
// set up: `config({relTol: 0.5})` is undone and refused, from any caller, instead of
// changing how every later comparison in the process is made. Documents cannot reach
// `config` at all (engine/sandbox compiles them against a namespace without it); this is
// the second wall. mathjs keeps the object itself private, so the change is reverted.
let reverting = false;
(instance as unknown as { on(event: 'config', f: (current: unknown, previous: object) => void): void }).on('config', (_current, previous) => {
  if (reverting) return;
  reverting = true;
  try {
    instance.config(previous as Parameters<typeof instance.config>[0]);
  } finally {
    reverting = false;
  }
  throw new SandboxError('the mathjs configuration is fixed');
});

export const math: MathJsInstance = instance;
