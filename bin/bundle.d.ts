// Types of bin/bundle.js (plain JavaScript, so the launcher can run it without a TypeScript loader).

/** Builds a new bundle, points `current` at it, and returns its entry path. */
export function buildBundle(): Promise<string>;

/** The bundle's entry, rebuilt first when any source is newer than it. */
export function ensureBundle(): Promise<string>;

/** Loads a CommonJS bundle with its V8 code cache for `key` (the command). */
export function loadBundle(entry: string, key: string): { exports: Record<string, unknown>; saveCodeCache(): void };

/** import() of the outside packages routed to the importer loadBundle passes in; throws on any other import(). */
export function routeImports(text: string): string;

/** The bundle text with every non-ASCII character written as an escape of the same meaning. */
export function asciiOnly(text: string): string;
