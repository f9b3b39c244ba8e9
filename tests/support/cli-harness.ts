import { openSync } from 'node:fs';
import { expect } from 'vitest';
import type { CliIo } from '../../src/cli/io';
import { main } from '../../src/cli/main';

/** What one in-process run of the command line wrote and returned. */
export interface Run {
  status: number;
  stdout: string;
  stderr: string;
}

/**
 * Standard input of in-process runs: empty. The test runner's own input may be a socket that never
 * ends, so a "-" operand or value read from it would block the whole worker.
 */
const EMPTY_STDIN = openSync('/dev/null', 'r');

/** Runs main() in-process and collects what it writes; "-" reads an empty standard input. */
export async function run(...argv: string[]): Promise<Run> {
  let stdout = '';
  let stderr = '';
  const io: CliIo = {
    stdinFd: EMPTY_STDIN,
    stdout: (text) => {
      stdout += text;
    },
    stderr: (text) => {
      stderr += text;
    },
  };
  const status = await main(argv, io);
  return { status, stdout, stderr };
}

/** Runs with --json, expects success, and returns the parsed object. */
export async function runJson<T = Record<string, unknown>>(...argv: string[]): Promise<T> {
  const result = await run(...argv, '--json');
  expect(result).toMatchObject({ status: 0, stderr: '' });
  return JSON.parse(result.stdout) as T;
}

/** Bad input: status 2, nothing on stdout, exactly one line on stderr, no stack frame. Returns the line. */
export function expectUsageError(result: Run): string {
  expect(result.status).toBe(2);
  expect(result.stdout).toBe('');
  expect(result.stderr.endsWith('\n')).toBe(true);
  const lines = result.stderr.split('\n').slice(0, -1);
  expect(lines).toHaveLength(1);
  expect(result.stderr).not.toMatch(/^\s*at /m);
  expect(result.stderr).not.toMatch(/\bat .*\.(ts|js|mjs):\d+/);
  expect(result.stderr.startsWith('sekundo: ')).toBe(true);
  return lines[0] ?? '';
}

/** Bad input with --json: status 2, nothing on stdout, one JSON object {error, field} on stderr. Returns it. */
export function expectJsonUsageError(result: Run): { error: string; field: string | null } {
  expect(result.status).toBe(2);
  expect(result.stdout).toBe('');
  expect(result.stderr.endsWith('\n')).toBe(true);
  expect(result.stderr.split('\n').slice(0, -1)).toHaveLength(1);
  const parsed = JSON.parse(result.stderr) as { error: string; field: string | null };
  expect(typeof parsed.error).toBe('string');
  expect(parsed.field === null || typeof parsed.field === 'string').toBe(true);
  return parsed;
}
