-- WindingNotes for Neovim 0.7 and later: the 'windingnotes' filetype for *.wn files, and the
-- language server (`windingnotes lsp`) started for them with vim.lsp.start_client.
--
--   require('windingnotes').setup()                                  -- the command on PATH
--   require('windingnotes').setup({ cmd = { 'dotnet', '/path/to/windingnotes.dll', 'lsp' } })
local M = {}

M.defaults = {
  cmd = { 'windingnotes', 'lsp' },
  -- Results at the end of each line, where Neovim draws inlay hints (0.10 and later).
  inlay_hints = true,
  -- Extra fields for vim.lsp.start_client (handlers, on_attach, on_exit, flags, ...).
  client = {},
}

local clients = {}

-- The folder that holds the file's repository, or the file's own folder.
local function root_of(bufnr)
  local file = vim.api.nvim_buf_get_name(bufnr)
  local dir = vim.fn.fnamemodify(file, ':p:h')
  local git = vim.fn.finddir('.git', dir .. ';')
  if git ~= '' then return vim.fn.fnamemodify(git, ':p:h:h') end
  return dir
end

-- Starts the server for the buffer's root once, attaches the buffer, and returns the client id.
function M.attach(bufnr, opts)
  opts = vim.tbl_deep_extend('force', M.defaults, opts or {})
  bufnr = bufnr == 0 and vim.api.nvim_get_current_buf() or bufnr
  local root = root_of(bufnr)
  local id = clients[root]
  if id == nil or vim.lsp.client_is_stopped(id) then
    id = vim.lsp.start_client(vim.tbl_extend('force', {
      name = 'windingnotes',
      cmd = opts.cmd,
      root_dir = root,
      workspace_folders = { { uri = vim.uri_from_fname(root), name = root } },
    }, opts.client))
    clients[root] = id
  end
  if id ~= nil then
    vim.lsp.buf_attach_client(bufnr, id)
    if opts.inlay_hints and vim.lsp.inlay_hint then vim.lsp.inlay_hint.enable(true, { bufnr = bufnr }) end
  end
  return id
end

-- Registers the filetype and attaches every buffer of it.
function M.setup(opts)
  vim.filetype.add({ extension = { wn = 'windingnotes' } })
  if vim.fn.has('nvim-0.8') == 0 then
    -- Neovim 0.7 reads vim.filetype.add only with vim.g.do_filetype_lua set; without it, *.wn would
    -- stay 'conf' (a file that starts with a comment). An autocommand names the type there.
    vim.api.nvim_create_autocmd({ 'BufRead', 'BufNewFile' }, { pattern = '*.wn', command = 'setlocal filetype=windingnotes' })
  end
  vim.api.nvim_create_autocmd('FileType', {
    pattern = 'windingnotes',
    callback = function(args) M.attach(args.buf, opts) end,
  })
end

return M
