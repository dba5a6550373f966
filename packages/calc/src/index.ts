// Public surface of the engine. Each concern lives in its own file; this file only re-exports.
export * from './circuit.ts';
export * from './errors.ts';
