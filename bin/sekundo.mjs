#!/usr/bin/env node
// Command-line entry. It runs the TypeScript sources directly through tsx,
// so `npx sekundo …` works in a fresh clone right after `npm ci`.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
