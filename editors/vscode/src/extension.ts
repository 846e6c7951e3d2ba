import * as fs from 'node:fs';
import * as os from 'node:os';
import * as vscode from 'vscode';
import { LanguageClient, LanguageClientOptions, ServerOptions } from 'vscode-languageclient/node';
import { resolveServer, ServerCommand } from './server';

let client: LanguageClient | undefined;

export async function activate(context: vscode.ExtensionContext): Promise<void> {
  context.subscriptions.push(
    vscode.commands.registerCommand('windingnotes.restartServer', restart),
    vscode.workspace.onDidChangeConfiguration(event => {
      if (event.affectsConfiguration('windingnotes.server')) void restart();
    }),
  );
  await start();
}

export function deactivate(): Promise<void> {
  return stop();
}

async function restart(): Promise<void> {
  await stop();
  await start();
}

function serverCommand(): ServerCommand {
  const settings = vscode.workspace.getConfiguration('windingnotes.server');
  return resolveServer(
    { path: settings.get<string>('path', 'windingnotes'), args: settings.get<string[]>('args', ['lsp']) },
    {
      platform: process.platform,
      env: process.env,
      home: os.homedir(),
      base: vscode.workspace.workspaceFolders?.[0]?.uri.fsPath,
      isFile: file => {
        try {
          return fs.statSync(file).isFile();
        } catch {
          return false;
        }
      },
    },
  );
}

async function start(): Promise<void> {
  const server = serverCommand();
  const serverOptions: ServerOptions = { command: server.command, args: server.args };
  const clientOptions: LanguageClientOptions = {
    documentSelector: [
      { scheme: 'file', language: 'windingnotes' },
      { scheme: 'untitled', language: 'windingnotes' },
    ],
  };
  // The id 'windingnotes' makes the client read the windingnotes.trace.server setting.
  const created = new LanguageClient('windingnotes', 'WindingNotes', serverOptions, clientOptions);
  client = created;
  try {
    await created.start();
  } catch (error) {
    client = undefined;
    await created.dispose().catch(() => undefined);
    const shown = [server.command, ...server.args].join(' ');
    const choice = await vscode.window.showErrorMessage(
      `WindingNotes: the language server did not start (${shown}): ${String(error)}. ` +
        'Install the windingnotes .NET tool (see the README) or set windingnotes.server.path.',
      'Open Settings',
    );
    if (choice === 'Open Settings') {
      await vscode.commands.executeCommand('workbench.action.openSettings', 'windingnotes.server');
    }
  }
}

async function stop(): Promise<void> {
  const running = client;
  client = undefined;
  if (running) await running.dispose().catch(() => undefined);
}
