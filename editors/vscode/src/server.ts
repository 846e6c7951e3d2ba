import * as path from 'node:path';

/** The server settings as the user gave them. */
export interface ServerSettings {
  path: string;
  args: string[];
}

/** What to run: an executable and its arguments. */
export interface ServerCommand {
  command: string;
  args: string[];
}

/** What the resolution needs from the machine, passed in so that it can be tested anywhere. */
export interface Machine {
  platform: NodeJS.Platform;
  env: NodeJS.ProcessEnv;
  home: string;
  /** The folder relative paths in the settings are taken from (the first workspace folder). */
  base?: string;
  isFile(file: string): boolean;
}

/**
 * Finds the server executable. A bare name is looked up on the PATH and then in the folder that
 * `dotnet tool install --global` uses, because an editor started from a desktop launcher often
 * lacks that folder on its PATH. A path is used as given (`~` is the home folder; a relative one
 * is taken from the workspace). When nothing is found the bare name is returned, so that the
 * error names what the user configured.
 */
export function resolveServer(settings: ServerSettings, machine: Machine): ServerCommand {
  const p = machine.platform === 'win32' ? path.win32 : path.posix;
  const name = settings.path.trim() || 'windingnotes';
  const args = [...settings.args];
  if (name === '~' || name.startsWith('~/') || name.startsWith('~\\')) {
    return { command: p.join(machine.home, name.slice(1)), args };
  }
  if (name.includes('/') || (machine.platform === 'win32' && name.includes('\\'))) {
    return { command: p.isAbsolute(name) || !machine.base ? name : p.resolve(machine.base, name), args };
  }
  const toolHome = machine.env.DOTNET_CLI_HOME || machine.home;
  const folders = [...searchPath(machine), p.join(toolHome, '.dotnet', 'tools')];
  for (const folder of folders) {
    for (const candidate of executableNames(name, machine)) {
      const file = p.join(folder, candidate);
      if (machine.isFile(file)) return { command: file, args };
    }
  }
  return { command: name, args };
}

function searchPath(machine: Machine): string[] {
  const value = machine.env.PATH ?? machine.env.Path ?? '';
  const delimiter = machine.platform === 'win32' ? ';' : ':';
  return value.split(delimiter).filter(folder => folder.length > 0);
}

/** On Windows a command is found with one of the extensions in PATHEXT. */
function executableNames(name: string, machine: Machine): string[] {
  if (machine.platform !== 'win32') return [name];
  const extensions = (machine.env.PATHEXT || '.COM;.EXE;.BAT;.CMD').split(';').filter(e => e.length > 0);
  const hasExtension = extensions.some(e => name.toUpperCase().endsWith(e.toUpperCase()));
  return hasExtension ? [name] : extensions.map(e => name + e.toLowerCase());
}
