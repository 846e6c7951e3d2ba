// Drives `windingnotes lsp` through the official protocol package, one check per feature.
// Usage: node client.mjs COMMAND [ARGS...]   (for example: node client.mjs dotnet windingnotes.dll lsp --stdio)
// Prints one line per check and exits 0 when every check passed, 1 otherwise.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import path from 'node:path';
import assert from 'node:assert/strict';
import protocol from 'vscode-languageserver-protocol/node.js';

const {
  createProtocolConnection, StreamMessageReader, StreamMessageWriter, CancellationTokenSource, ResponseError,
  InitializeRequest, InitializedNotification, ShutdownRequest, ExitNotification,
  DidOpenTextDocumentNotification, DidChangeTextDocumentNotification, PublishDiagnosticsNotification,
  HoverRequest, InlayHintRequest, CompletionRequest, DefinitionRequest, ReferencesRequest,
  PrepareRenameRequest, RenameRequest, DocumentSymbolRequest, SemanticTokensRequest,
  DocumentFormattingRequest, CodeActionRequest, CompletionItemKind, DiagnosticSeverity,
} = protocol;

const [command, ...args] = process.argv.slice(2);
if (!command) {
  console.error('usage: node client.mjs COMMAND [ARGS...]');
  process.exit(2);
}
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..', '..');
const examplePath = path.join(root, 'examples', 'alder-creek-boost.wn');
const example = readFileSync(examplePath, 'utf8').replace(/\r\n/g, '\n');
const uri = pathToFileURL(examplePath).href;

const watchdog = setTimeout(() => { console.error('FAIL: no end within 60 s'); process.exit(1); }, 60_000);
const server = spawn(command, args, { stdio: ['pipe', 'pipe', 'inherit'] });
const exited = new Promise((resolve) => server.on('exit', (code) => resolve(code)));
const connection = createProtocolConnection(new StreamMessageReader(server.stdout), new StreamMessageWriter(server.stdin));

// Diagnostics by uri and version, and waiters for the ones not yet published.
const published = new Map();
const waiting = [];
connection.onNotification(PublishDiagnosticsNotification.type, (p) => {
  published.set(`${p.uri}@${p.version}`, p.diagnostics);
  for (const w of waiting.filter((w) => w.key === `${p.uri}@${p.version}`)) w.resolve(p.diagnostics);
});
const diagnostics = (docUri, version) => published.has(`${docUri}@${version}`)
  ? Promise.resolve(published.get(`${docUri}@${version}`))
  : new Promise((resolve) => waiting.push({ key: `${docUri}@${version}`, resolve }));
connection.listen();

let passed = 0, failed = 0;
async function check(name, body) {
  try {
    await body();
    passed++;
    console.log(`ok   ${name}`);
  } catch (e) {
    failed++;
    console.log(`FAIL ${name}: ${e.message}`);
  }
}
const at = (line, character) => ({ textDocument: { uri }, position: { line, character } });
const lineRange = (from, to) => ({ start: { line: from, character: 0 }, end: { line: to, character: 0 } });
function apply(text, edits) {
  const lines = text.split('\n');
  const offset = (p) => lines.slice(0, p.line).reduce((n, l) => n + l.length + 1, 0) + p.character;
  const sorted = [...edits].sort((a, b) => offset(b.range.start) - offset(a.range.start));
  for (const e of sorted) text = text.slice(0, offset(e.range.start)) + e.newText + text.slice(offset(e.range.end));
  return text;
}

let capabilities;
await check('initialize announces every feature', async () => {
  const result = await connection.sendRequest(InitializeRequest.type, {
    processId: process.pid, rootUri: pathToFileURL(root).href, workspaceFolders: null,
    capabilities: {
      general: { positionEncodings: ['utf-16'] },
      textDocument: { rename: { prepareSupport: true }, hover: { contentFormat: ['markdown'] }, inlayHint: {} },
    },
  });
  capabilities = result.capabilities;
  assert.equal(capabilities.positionEncoding, 'utf-16');
  assert.equal(capabilities.textDocumentSync.change, 1);
  for (const f of ['hoverProvider', 'inlayHintProvider', 'definitionProvider', 'referencesProvider', 'documentSymbolProvider', 'documentFormattingProvider'])
    assert.equal(capabilities[f], true, f);
  assert.equal(capabilities.renameProvider.prepareProvider, true);
  assert.deepEqual(capabilities.codeActionProvider.codeActionKinds, ['quickfix']);
  connection.sendNotification(InitializedNotification.type, {});
});

const mistyped = example.replace('winding HV on K1', 'winding HV on K9');
connection.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'windingnotes', version: 1, text: mistyped } });

await check('a mistyped core is an error under K9', async () => {
  const found = (await diagnostics(uri, 1)).find((d) => d.code === 'unknown-name');
  assert.ok(found, 'no unknown-name diagnostic');
  assert.deepEqual(found.range, { start: { line: 4, character: 14 }, end: { line: 4, character: 16 } });
  assert.equal(found.severity, DiagnosticSeverity.Error);
  assert.match(found.message, /unknown core 'K9' \(did you mean 'K1'\?\)/);
});

await check('the quick fix changes K9 to K1, and the edit clears the error', async () => {
  const actions = await connection.sendRequest(CodeActionRequest.type, {
    textDocument: { uri }, range: { start: { line: 4, character: 14 }, end: { line: 4, character: 16 } }, context: { diagnostics: [] },
  });
  const fix = actions.find((a) => a.kind === 'quickfix');
  assert.ok(fix, 'no quick fix');
  const fixed = apply(mistyped, fix.edit.changes[uri]);
  assert.equal(fixed, example);
  connection.sendNotification(DidChangeTextDocumentNotification.type, { textDocument: { uri, version: 2 }, contentChanges: [{ text: fixed }] });
  const after = await diagnostics(uri, 2);
  assert.equal(after.filter((d) => d.severity === DiagnosticSeverity.Error).length, 0);
});

await check('inlay hints show 228.1 V at the load line', async () => {
  const hints = await connection.sendRequest(InlayHintRequest.type, { textDocument: { uri }, range: lineRange(0, 15) });
  const load = hints.find((h) => h.position.line === 11);
  assert.ok(load, 'no hint on the load line');
  assert.match(load.label, /^228\.1 V, 17\.11 A/);
  assert.ok(hints.some((h) => h.position.line === 13 && /^pass: 228\.1 V/.test(h.label)), 'no check hint');
});

await check('hover over LV shows 17.1 A', async () => {
  const hover = await connection.sendRequest(HoverRequest.type, at(5, 9));
  assert.equal(hover.contents.kind, 'markdown');
  assert.match(hover.contents.value, /17\.11 A/);
  assert.deepEqual(hover.range, { start: { line: 5, character: 8 }, end: { line: 5, character: 10 } });
});

await check('completion offers statements where a line starts', async () => {
  const list = await connection.sendRequest(CompletionRequest.type, at(2, 0));
  const items = Array.isArray(list) ? list : list.items;
  const winding = items.find((i) => i.label === 'winding');
  assert.ok(winding, 'no winding');
  assert.equal(winding.kind, CompletionItemKind.Keyword);
});

await check('definition of X2 is in the LV winding', async () => {
  const location = await connection.sendRequest(DefinitionRequest.type, at(10, 9));
  assert.equal(location.uri, uri);
  assert.deepEqual(location.range.start, { line: 5, character: 48 });
});

await check('references of H2 are its five places', async () => {
  const locations = await connection.sendRequest(ReferencesRequest.type, { ...at(9, 8), context: { includeDeclaration: true } });
  assert.deepEqual(locations.map((l) => l.range.start.line), [4, 8, 9, 11, 13]);
});

await check('rename HV to PRI, after prepareRename', async () => {
  const prepared = await connection.sendRequest(PrepareRenameRequest.type, at(4, 9));
  assert.equal(prepared.placeholder, 'HV');
  const edit = await connection.sendRequest(RenameRequest.type, { ...at(4, 9), newName: 'PRI' });
  const renamed = apply(example, edit.changes[uri]);
  assert.match(renamed, /winding PRI on K1/);
  assert.match(renamed, /impedance PRI LV/);
  await assert.rejects(connection.sendRequest(RenameRequest.type, { ...at(4, 9), newName: 'LV' }), (e) => e instanceof ResponseError && e.code === -32803);
});

await check('the outline has the core with its windings, the supply and the load', async () => {
  const symbols = await connection.sendRequest(DocumentSymbolRequest.type, { textDocument: { uri } });
  assert.deepEqual(symbols.map((s) => s.name), ['K1', 'mains', 'planer']);
  assert.deepEqual(symbols[0].children.map((s) => s.name), ['HV', 'LV']);
});

await check('semantic tokens colour the heading comment and the keywords', async () => {
  const tokens = await connection.sendRequest(SemanticTokensRequest.type, { textDocument: { uri } });
  const legend = capabilities.semanticTokensProvider.legend.tokenTypes;
  assert.equal(tokens.data.length % 5, 0);
  assert.equal(legend[tokens.data[3]], 'comment');
  assert.equal(legend[tokens.data[8]], 'keyword'); // 'frequency'
});

await check('formatting gives the canonical layout and is idempotent', async () => {
  const messy = example.replace('ground H2', 'ground   H2').replace('impedance HV LV 3.6 % xr 1.1', 'impedance HV  LV 3.6 %   xr 1.1');
  connection.sendNotification(DidChangeTextDocumentNotification.type, { textDocument: { uri, version: 3 }, contentChanges: [{ text: messy }] });
  const edits = await connection.sendRequest(DocumentFormattingRequest.type, { textDocument: { uri }, options: { tabSize: 4, insertSpaces: true } });
  const formatted = apply(messy, edits);
  assert.match(formatted, /\nground H2\nimpedance|\nimpedance HV LV 3\.6 % xr 1\.1\n/);
  assert.match(formatted, /\nground H2\n/);
  assert.match(formatted, /\njoin H1 X2 # series-aiding/);
  assert.equal(formatted.split('#').length, example.split('#').length, 'a comment was lost');
  connection.sendNotification(DidChangeTextDocumentNotification.type, { textDocument: { uri, version: 4 }, contentChanges: [{ text: formatted }] });
  assert.deepEqual(await connection.sendRequest(DocumentFormattingRequest.type, { textDocument: { uri }, options: { tabSize: 4, insertSpaces: true } }), []);
});

await check('positions count UTF-16 units after Ω, °, ² and ±', async () => {
  const other = pathToFileURL(path.join(root, 'unicode-check.wn')).href;
  const text = 'frequency 60 Hz\ncore K1 area 40 cm² flux-limit 1.5 T\nwinding W on K1 turns 10 from A to B resistance 1 Ω ± 5 % at 20 °C rated 1 V\nwinding X on K9 turns 10 from C to D\n';
  connection.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri: other, languageId: 'windingnotes', version: 1, text } });
  const found = (await diagnostics(other, 1)).find((d) => d.code === 'unknown-name');
  assert.deepEqual(found.range, { start: { line: 3, character: 13 }, end: { line: 3, character: 15 } });
  const hover = await connection.sendRequest(HoverRequest.type, { textDocument: { uri: other }, position: { line: 2, character: 50 } });
  assert.deepEqual(hover.range, { start: { line: 2, character: 48 }, end: { line: 2, character: 57 } });
});

await check('a cancelled request is answered, and the server goes on', async () => {
  const source = new CancellationTokenSource();
  const pending = connection.sendRequest(HoverRequest.type, at(5, 9), source.token);
  source.cancel();
  try {
    await pending;
  } catch (e) {
    assert.ok(e instanceof ResponseError && e.code === -32800, `unexpected ${e}`);
  }
  assert.ok(await connection.sendRequest(HoverRequest.type, at(5, 9)));
});

await check('an unknown method is answered with -32601', async () => {
  await assert.rejects(connection.sendRequest('windingnotes/noSuchMethod', {}), (e) => e instanceof ResponseError && e.code === -32601);
});

await check('shutdown then exit ends the server with code 0', async () => {
  await connection.sendRequest(ShutdownRequest.type);
  await connection.sendNotification(ExitNotification.type);
  assert.equal(await exited, 0);
});

clearTimeout(watchdog);
connection.dispose();
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
