-- Drives Neovim's built-in language client (0.7+) against `rectilens lsp --stdio`, headless.
-- Arguments come from the environment: RECTILENS_CLI (path of dist/cli.js), RECTILENS_OUT (a JSON
-- file to write), RECTILENS_HOVER_WORD (a word of the open file to hover over).
local out_path = os.getenv('RECTILENS_OUT')
local result = { diagnostics = {}, hover = '', attached = false }

local function finish()
  local file = io.open(out_path, 'w')
  file:write(vim.fn.json_encode(result))
  file:close()
  vim.cmd('qa!')
end

local ok, err = pcall(function()
  local bufnr = vim.api.nvim_get_current_buf()
  local client_id = vim.lsp.start_client({
    name = 'rectilens',
    cmd = { 'node', os.getenv('RECTILENS_CLI'), 'lsp', '--stdio' },
    root_dir = vim.fn.getcwd(),
  })
  result.attached = vim.lsp.buf_attach_client(bufnr, client_id)
  vim.wait(20000, function() return #vim.diagnostic.get(bufnr) > 0 end, 50)
  for _, d in ipairs(vim.diagnostic.get(bufnr)) do
    table.insert(result.diagnostics, { lnum = d.lnum, col = d.col, severity = d.severity, message = d.message, code = d.code })
  end
  -- Hover over the first occurrence of the chosen word.
  local word = os.getenv('RECTILENS_HOVER_WORD')
  local lines = vim.api.nvim_buf_get_lines(bufnr, 0, -1, false)
  for lnum, line in ipairs(lines) do
    local col = string.find(line, word, 1, true)
    if col and not string.match(line, '^%*') then
      local params = { textDocument = vim.lsp.util.make_text_document_params(bufnr), position = { line = lnum - 1, character = col } }
      local responses = vim.lsp.buf_request_sync(bufnr, 'textDocument/hover', params, 10000) or {}
      for _, response in pairs(responses) do
        if response.result and response.result.contents then
          local contents = response.result.contents
          result.hover = type(contents) == 'table' and (contents.value or '') or tostring(contents)
        end
      end
      break
    end
  end
end)
if not ok then result.error = tostring(err) end
finish()
