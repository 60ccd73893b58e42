// Minimal typings for the parts of @observablehq/runtime the engine uses.
declare module '@observablehq/runtime' {
  export interface Observer {
    pending?(): void;
    fulfilled?(value: unknown, name?: string): void;
    rejected?(error: unknown, name?: string): void;
  }
  export interface Variable {
    define(name: string, inputs: string[], definition: (...args: any[]) => unknown): Variable;
    delete(): Variable;
  }
  export interface Module {
    variable(observer?: Observer | boolean): Variable;
    value(name: string): Promise<unknown>;
  }
  export class Runtime {
    constructor(builtins?: Record<string, unknown>, global?: (name: string) => unknown);
    module(): Module;
    dispose(): void;
  }
}
