import calcPackage from '../package.json' with { type: 'json' };

/**
 * Version of the engine, from packages/calc/package.json (read when the code is built or
 * loaded, in Node and in the browser bundle alike). Stored results record it, so a later
 * engine can tell which engine computed them.
 */
export const ENGINE_VERSION: string = calcPackage.version;
