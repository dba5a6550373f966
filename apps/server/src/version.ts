import { readFileSync } from 'node:fs';

/** The product version, from the server's package.json (one source of truth). */
export const appVersion: string = (
  JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as {
    version: string;
  }
).version;
