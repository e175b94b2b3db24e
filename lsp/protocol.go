package lsp

// The subset of the Language Server Protocol 3.17 that the server speaks,
// as plain structs with explicit JSON names.

// Error codes beyond those of JSON-RPC 2.0.
const (
	codeServerNotInitialized = -32002
	codeRequestFailed        = -32803
)

// Text document sync kinds.
const (
	syncFull        = 1
	syncIncremental = 2
)

// Diagnostic severities.
const (
	severityError       = 1
	severityWarning     = 2
	severityInformation = 3
)

// Symbol kinds (DocumentSymbol.Kind).
const (
	symbolKindFile      = 1
	symbolKindNamespace = 3
	symbolKindEnum      = 10
	symbolKindFunction  = 12
	symbolKindConstant  = 14
	symbolKindObject    = 19
	symbolKindStruct    = 23
)

// Completion item kinds.
const (
	completionKindFunction = 3
	completionKindKeyword  = 14
	completionKindConstant = 21
)

// Position is a zero-based line and a character offset in the negotiated
// position encoding.
type Position struct {
	Line      uint32 `json:"line"`
	Character uint32 `json:"character"`
}

// Range is a half-open range of positions.
type Range struct {
	Start Position `json:"start"`
	End   Position `json:"end"`
}

// Location is a range in a document.
type Location struct {
	URI   string `json:"uri"`
	Range Range  `json:"range"`
}

// InitializeParams is what the client says about itself in initialize.
type InitializeParams struct {
	ProcessID *int    `json:"processId"`
	RootURI   *string `json:"rootUri"`
	// WorkspaceFolders are the folders open in the editor; includes may
	// read from them (as from the root document's own folder tree).
	WorkspaceFolders []WorkspaceFolder  `json:"workspaceFolders,omitempty"`
	ClientInfo       *ClientInfo        `json:"clientInfo,omitempty"`
	Capabilities     ClientCapabilities `json:"capabilities"`
}

// ClientInfo names the client.
type ClientInfo struct {
	Name    string `json:"name"`
	Version string `json:"version,omitempty"`
}

// ClientCapabilities is the part of the client's capabilities the server
// reads.
type ClientCapabilities struct {
	General      *GeneralClientCapabilities      `json:"general,omitempty"`
	TextDocument *TextDocumentClientCapabilities `json:"textDocument,omitempty"`
}

// GeneralClientCapabilities holds the position encodings the client offers.
type GeneralClientCapabilities struct {
	PositionEncodings []string `json:"positionEncodings,omitempty"`
}

// TextDocumentClientCapabilities holds what the client can show in a hover.
type TextDocumentClientCapabilities struct {
	Hover *HoverClientCapabilities `json:"hover,omitempty"`
}

// HoverClientCapabilities lists the markup kinds a client renders in hovers.
type HoverClientCapabilities struct {
	ContentFormat []string `json:"contentFormat,omitempty"`
}

// InitializeResult is the server's answer to initialize.
type InitializeResult struct {
	Capabilities ServerCapabilities `json:"capabilities"`
	ServerInfo   ServerInfo         `json:"serverInfo"`
}

// ServerInfo names the server.
type ServerInfo struct {
	Name    string `json:"name"`
	Version string `json:"version,omitempty"`
}

// ServerCapabilities is what the server offers.
type ServerCapabilities struct {
	PositionEncoding           string                  `json:"positionEncoding"`
	TextDocumentSync           TextDocumentSyncOptions `json:"textDocumentSync"`
	HoverProvider              bool                    `json:"hoverProvider"`
	DefinitionProvider         bool                    `json:"definitionProvider"`
	DocumentSymbolProvider     bool                    `json:"documentSymbolProvider"`
	CompletionProvider         CompletionOptions       `json:"completionProvider"`
	DocumentFormattingProvider bool                    `json:"documentFormattingProvider"`
	Workspace                  *WorkspaceCapabilities  `json:"workspace,omitempty"`
}

// WorkspaceCapabilities says what the server does with workspace folders.
type WorkspaceCapabilities struct {
	WorkspaceFolders WorkspaceFoldersServerCapabilities `json:"workspaceFolders"`
}

// WorkspaceFoldersServerCapabilities: the server reads the workspace
// folders and wants to hear when they change.
type WorkspaceFoldersServerCapabilities struct {
	Supported           bool `json:"supported"`
	ChangeNotifications bool `json:"changeNotifications"`
}

// DidChangeWorkspaceFoldersParams is workspace/didChangeWorkspaceFolders.
type DidChangeWorkspaceFoldersParams struct {
	Event struct {
		Added   []WorkspaceFolder `json:"added"`
		Removed []WorkspaceFolder `json:"removed"`
	} `json:"event"`
}

// TextDocumentSyncOptions says how documents are synchronised.
type TextDocumentSyncOptions struct {
	OpenClose bool        `json:"openClose"`
	Change    int         `json:"change"`
	Save      SaveOptions `json:"save"`
}

// SaveOptions says whether didSave carries the text.
type SaveOptions struct {
	IncludeText bool `json:"includeText"`
}

// CompletionOptions lists the characters that start completion.
type CompletionOptions struct {
	TriggerCharacters []string `json:"triggerCharacters,omitempty"`
}

// TextDocumentIdentifier names a document.
type TextDocumentIdentifier struct {
	URI string `json:"uri"`
}

// VersionedTextDocumentIdentifier names a document at a version.
type VersionedTextDocumentIdentifier struct {
	URI     string `json:"uri"`
	Version int32  `json:"version"`
}

// TextDocumentItem is a document as opened, with its text.
type TextDocumentItem struct {
	URI        string `json:"uri"`
	LanguageID string `json:"languageId"`
	Version    int32  `json:"version"`
	Text       string `json:"text"`
}

// DidOpenTextDocumentParams is the didOpen notification.
type DidOpenTextDocumentParams struct {
	TextDocument TextDocumentItem `json:"textDocument"`
}

// TextDocumentContentChangeEvent is one change: the whole text when Range
// is nil, else the replacement of Range.
type TextDocumentContentChangeEvent struct {
	Range *Range `json:"range,omitempty"`
	Text  string `json:"text"`
}

// DidChangeTextDocumentParams is the didChange notification.
type DidChangeTextDocumentParams struct {
	TextDocument   VersionedTextDocumentIdentifier  `json:"textDocument"`
	ContentChanges []TextDocumentContentChangeEvent `json:"contentChanges"`
}

// DidSaveTextDocumentParams is the didSave notification.
type DidSaveTextDocumentParams struct {
	TextDocument TextDocumentIdentifier `json:"textDocument"`
	Text         *string                `json:"text,omitempty"`
}

// DidCloseTextDocumentParams is the didClose notification.
type DidCloseTextDocumentParams struct {
	TextDocument TextDocumentIdentifier `json:"textDocument"`
}

// Diagnostic is one finding as the client shows it.
type Diagnostic struct {
	Range              Range                          `json:"range"`
	Severity           int                            `json:"severity"`
	Code               string                         `json:"code,omitempty"`
	Source             string                         `json:"source"`
	Message            string                         `json:"message"`
	RelatedInformation []DiagnosticRelatedInformation `json:"relatedInformation,omitempty"`
}

// DiagnosticRelatedInformation is a secondary location of a diagnostic.
type DiagnosticRelatedInformation struct {
	Location Location `json:"location"`
	Message  string   `json:"message"`
}

// PublishDiagnosticsParams replaces every diagnostic of one document. An
// empty Diagnostics list clears them.
type PublishDiagnosticsParams struct {
	URI         string       `json:"uri"`
	Version     *int32       `json:"version,omitempty"`
	Diagnostics []Diagnostic `json:"diagnostics"`
}

// TextDocumentPositionParams names a position in a document.
type TextDocumentPositionParams struct {
	TextDocument TextDocumentIdentifier `json:"textDocument"`
	Position     Position               `json:"position"`
}

// MarkupContent is text for a person, as markdown or plain text.
type MarkupContent struct {
	Kind  string `json:"kind"`
	Value string `json:"value"`
}

// Hover is the answer to a hover request.
type Hover struct {
	Contents MarkupContent `json:"contents"`
	Range    *Range        `json:"range,omitempty"`
}

// DocumentSymbolParams asks for a document's outline.
type DocumentSymbolParams struct {
	TextDocument TextDocumentIdentifier `json:"textDocument"`
}

// DocumentSymbol is one entry of a document's outline.
type DocumentSymbol struct {
	Name           string `json:"name"`
	Detail         string `json:"detail,omitempty"`
	Kind           int    `json:"kind"`
	Range          Range  `json:"range"`
	SelectionRange Range  `json:"selectionRange"`
}

// CompletionItem is one suggestion.
type CompletionItem struct {
	Label      string    `json:"label"`
	Kind       int       `json:"kind"`
	Detail     string    `json:"detail,omitempty"`
	SortText   string    `json:"sortText,omitempty"`
	FilterText string    `json:"filterText,omitempty"`
	TextEdit   *TextEdit `json:"textEdit,omitempty"`
}

// CompletionList is the answer to a completion request.
type CompletionList struct {
	IsIncomplete bool             `json:"isIncomplete"`
	Items        []CompletionItem `json:"items"`
}

// DocumentFormattingParams asks for the edits that format a document.
type DocumentFormattingParams struct {
	TextDocument TextDocumentIdentifier `json:"textDocument"`
	// Options are the editor's preferences; the canonical layout does not
	// depend on them, but the protocol requires them.
	Options FormattingOptions `json:"options"`
}

// FormattingOptions are an editor's formatting preferences.
type FormattingOptions struct {
	TabSize      uint32 `json:"tabSize"`
	InsertSpaces bool   `json:"insertSpaces"`
}

// TextEdit replaces a range with new text.
type TextEdit struct {
	Range   Range  `json:"range"`
	NewText string `json:"newText"`
}

// WorkspaceFolder is one folder open in the editor.
type WorkspaceFolder struct {
	URI  string `json:"uri"`
	Name string `json:"name"`
}
