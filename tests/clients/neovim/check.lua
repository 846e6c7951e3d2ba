-- Headless Neovim 0.7.2 against windingnotes lsp, set up as the README says: setup() from
-- editors/neovim/windingnotes.lua, then a *.wn file opened.
-- Run: nvim --headless --clean -n -c 'luafile tests/clients/neovim/check.lua'
-- with WINDINGNOTES_REPO (the repository) and WINDINGNOTES_SERVER (the command that starts the
-- server without its 'lsp', one word a line: 'dotnet' and windingnotes.dll, or the installed tool).
-- --clean keeps Neovim's own filetype detection (which reads a *.wn file as 'conf') and skips the
-- user's configuration. Prints one line per check and "N passed, N failed"; exits 0 when all passed.
local passed, failed = 0, 0
local function out(line) io.stdout:write(line .. '\n') end
local function check(name, ok, detail)
  if ok then passed = passed + 1; out('ok   ' .. name)
  else failed = failed + 1; out('FAIL ' .. name .. (detail and (': ' .. detail) or '')) end
  return ok
end
local function finish()
  out(string.format('%d passed, %d failed', passed, failed))
  vim.cmd(failed == 0 and 'qall!' or 'cquit!')
end

-- Any error in the checks themselves is a failure too, and Neovim still quits.
local function main()
  local repo = assert(os.getenv('WINDINGNOTES_REPO'), 'WINDINGNOTES_REPO is not set')
  local cmd = vim.split(assert(os.getenv('WINDINGNOTES_SERVER'), 'WINDINGNOTES_SERVER is not set'), '\n', { trimempty = true })
  table.insert(cmd, 'lsp')
  package.path = repo .. '/editors/neovim/?.lua;' .. package.path
  local windingnotes = require('windingnotes')
  -- No swap file (-n), no shada (--clean); the client logs only its own errors.
  vim.lsp.set_log_level('ERROR')

  local publishes, exit_code = 0, nil
  windingnotes.setup({
    cmd = cmd,
    client = {
      flags = { debounce_text_changes = 0 },
      handlers = {
        ['textDocument/publishDiagnostics'] = function(err, result, ctx, config)
          publishes = publishes + 1
          vim.lsp.diagnostic.on_publish_diagnostics(err, result, ctx, config)
        end,
      },
      on_exit = function(code) exit_code = code end,
    },
  })
  vim.cmd('edit ' .. vim.fn.fnameescape(repo .. '/examples/alder-creek-boost.wn'))
  local buf = vim.api.nvim_get_current_buf()
  check('setup() gives *.wn its file type', vim.bo[buf].filetype == 'windingnotes', vim.bo[buf].filetype)
  -- The buffer lists its client once the server has answered 'initialize'.
  vim.wait(30000, function() return next(vim.lsp.buf_get_clients(buf)) ~= nil end, 20)
  local id = next(vim.lsp.buf_get_clients(buf))
  if not check('the client started', id ~= nil) then return end

  local function errors() return vim.diagnostic.get(buf, { severity = vim.diagnostic.severity.ERROR }) end

  check('diagnostics arrive for the opened file', vim.wait(30000, function() return publishes > 0 end, 20))
  check('the example has no error', #errors() == 0, vim.inspect(errors()))

  local line5 = vim.api.nvim_buf_get_lines(buf, 4, 5, false)[1]
  vim.api.nvim_buf_set_lines(buf, 4, 5, false, { (line5:gsub('on K1', 'on K9')) })
  local function unknown()
    for _, d in ipairs(errors()) do
      if d.code == 'unknown-name' then return d end
    end
  end
  local underlined = vim.wait(20000, function() return unknown() ~= nil end, 20)
  local e = unknown() or {}
  check('mistyping the core puts an error under K9', underlined and e.lnum == 4 and e.col == 14 and e.end_col == 16
    and (e.message or ''):find("unknown core 'K9'", 1, true) ~= nil, vim.inspect(e))

  vim.api.nvim_buf_set_lines(buf, 4, 5, false, { line5 })
  check('fixing it clears the error', vim.wait(20000, function() return #errors() == 0 end, 20), vim.inspect(errors()))

  local uri = vim.uri_from_bufnr(buf)
  local hover = vim.lsp.buf_request_sync(buf, 'textDocument/hover', { textDocument = { uri = uri }, position = { line = 5, character = 9 } }, 20000)
  local value = hover and hover[id] and hover[id].result and hover[id].result.contents.value or ''
  check('hover over LV shows 17.11 A', value:find('17.11 A', 1, true) ~= nil, value)

  local hints = vim.lsp.buf_request_sync(buf, 'textDocument/inlayHint', {
    textDocument = { uri = uri }, range = { start = { line = 0, character = 0 }, ['end'] = { line = 15, character = 0 } },
  }, 20000)
  local load = ''
  for _, h in ipairs(hints and hints[id] and hints[id].result or {}) do
    if h.position.line == 11 then load = h.label end
  end
  check('the load line shows 228.1 V', load:find('^228.1 V') ~= nil, load)

  vim.lsp.stop_client(id)
  check('the server shuts down with code 0', vim.wait(20000, function() return exit_code ~= nil end, 20) and exit_code == 0, tostring(exit_code))
end

local ok, err = xpcall(main, debug.traceback)
check('the checks ran to the end', ok, err)
finish()
