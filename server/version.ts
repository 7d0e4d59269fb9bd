import { readFileSync } from 'node:fs';

/** The package version, read once from package.json at the project root. */
export const APP_VERSION: string = (
  JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string }
).version;
