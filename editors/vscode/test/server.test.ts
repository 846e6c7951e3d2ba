import assert from 'node:assert/strict';
import { test } from 'node:test';
import { Machine, resolveServer } from '../src/server';

function machine(files: string[], overrides: Partial<Machine> = {}): Machine {
  return {
    platform: 'linux',
    env: { PATH: '/usr/local/bin:/usr/bin' },
    home: '/home/ana',
    isFile: file => files.includes(file),
    ...overrides,
  };
}

const defaults = { path: 'windingnotes', args: ['lsp'] };

test('a bare name is found on the PATH, first folder first', () => {
  const found = resolveServer(defaults, machine(['/usr/bin/windingnotes', '/usr/local/bin/windingnotes']));
  assert.deepEqual(found, { command: '/usr/local/bin/windingnotes', args: ['lsp'] });
});

test('a bare name missing from the PATH is found among the global .NET tools', () => {
  const found = resolveServer(defaults, machine(['/home/ana/.dotnet/tools/windingnotes']));
  assert.equal(found.command, '/home/ana/.dotnet/tools/windingnotes');
});

test('DOTNET_CLI_HOME moves the global tools folder', () => {
  const found = resolveServer(defaults, machine(['/opt/cli/.dotnet/tools/windingnotes'], { env: { PATH: '/usr/bin', DOTNET_CLI_HOME: '/opt/cli' } }));
  assert.equal(found.command, '/opt/cli/.dotnet/tools/windingnotes');
});

test('a name found nowhere is kept, so the error names it', () => {
  assert.deepEqual(resolveServer(defaults, machine([])), { command: 'windingnotes', args: ['lsp'] });
});

test('an empty path setting means the default name', () => {
  const found = resolveServer({ path: '  ', args: ['lsp'] }, machine(['/usr/bin/windingnotes']));
  assert.equal(found.command, '/usr/bin/windingnotes');
});

test('paths are used as given: absolute, from the home folder, or from the workspace', () => {
  const m = machine([], { base: '/work/pumps' });
  assert.equal(resolveServer({ path: '/opt/wn/windingnotes', args: [] }, m).command, '/opt/wn/windingnotes');
  assert.equal(resolveServer({ path: '~/bin/windingnotes', args: [] }, m).command, '/home/ana/bin/windingnotes');
  assert.equal(resolveServer({ path: './tools/windingnotes', args: [] }, m).command, '/work/pumps/tools/windingnotes');
});

test('the arguments are passed through and not shared with the settings', () => {
  const settings = { path: 'windingnotes', args: ['lsp', '--log', 'trace'] };
  const found = resolveServer(settings, machine([]));
  assert.deepEqual(found.args, ['lsp', '--log', 'trace']);
  assert.notEqual(found.args, settings.args);
});

test('on Windows the PATH is split on semicolons and PATHEXT gives the file name', () => {
  const found = resolveServer(defaults, machine(['C:\\Users\\ana\\.dotnet\\tools\\windingnotes.exe'], {
    platform: 'win32',
    env: { Path: 'C:\\Windows;C:\\Users\\ana\\.dotnet\\tools', PATHEXT: '.COM;.EXE;.BAT' },
    home: 'C:\\Users\\ana',
  }));
  assert.equal(found.command, 'C:\\Users\\ana\\.dotnet\\tools\\windingnotes.exe');
});
