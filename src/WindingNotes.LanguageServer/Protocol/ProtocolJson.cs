using System.Text.Json;
using System.Text.Json.Serialization;

namespace WindingNotes.LanguageServer.Protocol;

/// <summary>
/// The protocol's JSON, generated at compile time (camelCase, nulls left out): every shape a route
/// reads or answers with, and what the publisher sends. Serialisation reads no type by reflection,
/// so the language server works in the NativeAOT build; a shape missing here fails in every build
/// (the resolver has no reflection fallback), so the tests find it.
/// </summary>
[JsonSourceGenerationOptions(PropertyNamingPolicy = JsonKnownNamingPolicy.CamelCase, DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull)]
// Parameters; RequestId is what StreamJsonRpc's own '$/cancelRequest' reads through these options.
[JsonSerializable(typeof(JsonElement?))]
[JsonSerializable(typeof(StreamJsonRpc.RequestId))]
[JsonSerializable(typeof(InitializeParams))]
[JsonSerializable(typeof(DidOpenTextDocumentParams))]
[JsonSerializable(typeof(DidChangeTextDocumentParams))]
[JsonSerializable(typeof(DidCloseTextDocumentParams))]
[JsonSerializable(typeof(TextDocumentPositionParams))]
[JsonSerializable(typeof(InlayHintParams))]
[JsonSerializable(typeof(CompletionParams))]
[JsonSerializable(typeof(ReferenceParams))]
[JsonSerializable(typeof(RenameParams))]
[JsonSerializable(typeof(DocumentSymbolParams))]
[JsonSerializable(typeof(SemanticTokensParams))]
[JsonSerializable(typeof(DocumentFormattingParams))]
[JsonSerializable(typeof(CodeActionParams))]
// Answers and notifications; RenameOptions and bool are what ServerCapabilities.RenameProvider holds.
[JsonSerializable(typeof(InitializeResult))]
[JsonSerializable(typeof(RenameOptions))]
[JsonSerializable(typeof(bool))]
[JsonSerializable(typeof(object))]
[JsonSerializable(typeof(Hover))]
[JsonSerializable(typeof(LspInlayHint[]))]
[JsonSerializable(typeof(CompletionList))]
[JsonSerializable(typeof(Location))]
[JsonSerializable(typeof(Location[]))]
[JsonSerializable(typeof(PrepareRenameResult))]
[JsonSerializable(typeof(WorkspaceEdit))]
[JsonSerializable(typeof(DocumentSymbol[]))]
[JsonSerializable(typeof(LspSemanticTokens))]
[JsonSerializable(typeof(LspTextEdit[]))]
[JsonSerializable(typeof(CodeAction[]))]
[JsonSerializable(typeof(PublishDiagnosticsParams))]
internal sealed partial class ProtocolJson : JsonSerializerContext;
