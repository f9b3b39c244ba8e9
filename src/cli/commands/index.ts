/**
 * The command table: every command, in the order `sekundo --help` lists them, each loaded only
 * when it is used, so `sekundo --version` loads no command and `sekundo props` loads only props
 * (and the kernel files it needs) — the CLI bundle splits at these imports. Add new commands here.
 */
import type { Command } from '../command';

/** One command's name and how to load it. */
export interface CommandEntry {
  readonly name: string;
  readonly load: () => Promise<Command>;
}

export const COMMAND_TABLE: readonly CommandEntry[] = [
  { name: 'props', load: async () => (await import('./props')).propsCommand },
  { name: 'vapour', load: async () => (await import('./vapour')).vapourCommand },
  { name: 'arrivals', load: async () => (await import('./arrivals')).arrivalsCommand },
  { name: 'plan', load: async () => (await import('./plan')).planCommand },
  { name: 'rehearse', load: async () => (await import('./rehearse')).rehearseCommand },
  { name: 'delay', load: async () => (await import('./delay')).delayCommand },
  { name: 'trace', load: async () => (await import('./trace')).traceCommand },
  { name: 'fit', load: async () => (await import('./fit')).fitCommand },
  { name: 'locate', load: async () => (await import('./locate')).locateCommand },
  { name: 'watch', load: async () => (await import('./watch')).watchCommand },
  { name: 'resonator', load: async () => (await import('./resonator')).resonatorCommand },
  { name: 'sweep', load: async () => (await import('./sweep')).sweepCommand },
  { name: 'lockin', load: async () => (await import('./lockin')).lockinCommand },
];

/** Every command, loaded, in table order (for `sekundo --help` and the tests). */
export function loadAllCommands(): Promise<Command[]> {
  return Promise.all(COMMAND_TABLE.map((entry) => entry.load()));
}
