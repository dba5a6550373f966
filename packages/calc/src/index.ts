// Public surface of the engine. Each concern lives in its own file; this file only re-exports.
export * from './circuit.ts';
export * from './errors.ts';
export * from './values.ts';
export * from './values-format.ts';
export * from './deck-parse.ts';
export * from './deck-export.ts';
export * from './constants.ts';
export * from './options.ts';
export * from './operating-point.ts';
export * from './dc.ts';
export * from './ac.ts';
export * from './small-signal.ts';
export * from './compare.ts';
export * from './signal-size.ts';
export * from './load-line.ts';
