#!/usr/bin/env node
// Node 20 cannot load TypeScript by itself: register tsx's loader, then run the engine's CLI
// from its sources, so the command needs no build step.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli.ts');
main();
